import { error } from '@sveltejs/kit';
import { findGuide, listGuides } from '$lib/guides';
import type { PageLoad } from './$types';

// Public: the built-in guides and the nursery's published ones are for everyone, signed in or not.
export const load: PageLoad = ({ params, data }) => {
	const all = listGuides();
	const link = (g: (typeof all)[number] | undefined) => (g ? { slug: g.slug, title: g.title } : null);
	if (data.nursery) {
		const replaced = data.nursery.replaces ? all.findIndex((g) => g.slug === data.nursery!.replaces) : -1;
		return { guide: null, nursery: data.nursery, previous: link(all[replaced - 1]), next: replaced >= 0 ? link(all[replaced + 1]) : null };
	}
	const guide = findGuide(params.slug);
	if (!guide) error(404, `No guide called “${params.slug}”`);
	const at = all.findIndex((g) => g.slug === guide.slug);
	return { guide, nursery: null, previous: link(all[at - 1]), next: link(all[at + 1]) };
};
