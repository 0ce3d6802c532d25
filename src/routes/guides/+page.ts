import { combineGuides, type ListedGuide } from '$lib/board/guides';
import { CULTIVAR_GROUPS } from '$lib/board/vocabulary';
import { GUIDE_STAGES, listGuides } from '$lib/guides';
import { guideFilterSchema } from '$lib/schema/guides';
import type { PageLoad } from './$types';

// Public: the built-in guides beside the nursery's published ones, for everyone.
export const load: PageLoad = ({ data, url }) => {
	const filter = guideFilterSchema.parse({ stage: url.searchParams.get('stage') ?? undefined, group: url.searchParams.get('group') ?? undefined });
	const builtIn: ListedGuide[] = listGuides().map((g) => ({ slug: g.slug, title: g.title, summary: g.summary, stages: [g.stage], groups: [], origin: 'built-in', order: g.order }));
	const nursery = data.nursery.map((g, i) => ({ ...g, origin: 'nursery' as const, order: 10_000 + i }));
	return { guides: combineGuides(builtIn, nursery, filter), filter, stages: GUIDE_STAGES, groups: CULTIVAR_GROUPS };
};
