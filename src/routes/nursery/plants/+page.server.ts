import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { plantTableService } from '$lib/server/plant-table/service';
import type { PageServerLoad } from './$types';

/** The filters' choices; the rows come from GET /api/v1/plants (see +page.ts), on the server first and then in the browser. */
export const load: PageServerLoad = async (event) => {
	requireUser(event, ...STAFF_ROLES);
	return { choices: await plantTableService.filterChoices() };
};
