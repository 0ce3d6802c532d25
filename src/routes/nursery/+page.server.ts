import { findClimate } from '$lib/care';
import { requireUser } from '$lib/server/auth';
import { accounts } from '$lib/server/accounts/service';
import { config } from '$lib/server/config';
import { nurseryService } from '$lib/server/nursery/service';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, 'owner');
	const [byRole, settings, profile] = await Promise.all([accounts.countByRole(), nurseryService.settings(), nurseryService.publicProfile()]);
	return {
		byRole,
		profile,
		feeding: settings
			? {
					fertilizer: settings.fertilizerName,
					npk: settings.npk,
					climate: findClimate(settings.defaultClimate)?.name ?? settings.defaultClimate,
					restrictedMonths: settings.restrictedMonths
				}
			: null,
		devMailbox: config.devMailbox
	};
};
