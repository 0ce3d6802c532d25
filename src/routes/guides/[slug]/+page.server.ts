import { redirect } from '@sveltejs/kit';
import { findGuide } from '$lib/guides';
import { guideService } from '$lib/server/guides/service';
import type { PageServerLoad } from './$types';

// Public: published guides are for everyone. A built-in guide the nursery has replaced sends
// visitors on to the nursery's own, so every link from plans, plant pages and mail follows it.
export const load: PageServerLoad = async ({ params }) => {
	if (findGuide(params.slug)) {
		const replacement = await guideService.replacementFor(params.slug);
		if (replacement) redirect(307, `/guides/${replacement.slug}`);
		return { nursery: null };
	}
	const own = await guideService.findPublished(params.slug);
	return {
		nursery: own ? { slug: own.slug, title: own.title, summary: own.summary, stages: own.stages, groups: own.groups, bodyHtml: own.bodyHtml, replaces: own.replaces } : null
	};
};
