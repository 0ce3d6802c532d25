import { nurseryService } from '$lib/server/nursery/service';
import type { PageServerLoad } from './$types';

// Public home page.
export const load: PageServerLoad = async ({ locals }) => ({
	nursery: await nurseryService.publicProfile(),
	signedIn: locals.user != null
});
