import { requireUser } from '$lib/server/auth';
import { accounts } from '$lib/server/accounts/service';
import { config } from '$lib/server/config';
import { nurseryService } from '$lib/server/nursery/service';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, 'owner');
	const [byRole, { feeding, profile }] = await Promise.all([accounts.countByRole(), nurseryService.dashboard()]);
	return { byRole, feeding, profile, devMailbox: config.devMailbox };
};
