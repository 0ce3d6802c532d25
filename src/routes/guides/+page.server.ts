import { guideService } from '$lib/server/guides/service';
import type { PageServerLoad } from './$types';

// Public: published guides are for everyone, signed in or not; drafts never leave the nursery pages.
export const load: PageServerLoad = async () => ({
	nursery: (await guideService.listPublished()).map(({ slug, title, summary, stages, groups, replaces }) => ({ slug, title, summary, stages, groups, replaces }))
});
