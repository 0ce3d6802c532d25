import { guidesByStage, listGuides } from '$lib/guides';
import type { PageLoad } from './$types';

// Public: the built-in guides are for everyone, signed in or not.
export const load: PageLoad = () => ({
	stages: guidesByStage(listGuides()).map((s) => ({
		stage: s.stage,
		guides: s.guides.map(({ slug, title, summary }) => ({ slug, title, summary }))
	}))
});
