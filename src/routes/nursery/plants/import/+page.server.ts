import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = (event) => {
	requireUser(event, ...STAFF_ROLES);
	return {};
};
