import { requireUser } from '$lib/server/auth';
import { accounts } from '$lib/server/accounts/service';
import { nurseryService } from '$lib/server/nursery/service';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, 'owner');
	const [people, profile] = await Promise.all([accounts.countTeam(), nurseryService.publicProfile()]);
	return { people, profile };
};
