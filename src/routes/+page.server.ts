import { nurseryService } from '$lib/server/nursery/service';
import type { PageServerLoad } from './$types';

// Public: the home page for buyers.
export const load: PageServerLoad = async ({ locals }) => ({
	nursery: await nurseryService.publicProfile(),
	signedIn: locals.user != null
});
