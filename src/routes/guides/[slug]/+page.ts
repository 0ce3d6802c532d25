import { error } from '@sveltejs/kit';
import { findGuide, listGuides } from '$lib/guides';
import type { PageLoad } from './$types';

// Public: the built-in guides are for everyone, signed in or not.
export const load: PageLoad = ({ params }) => {
	const guide = findGuide(params.slug);
	if (!guide) error(404, `No guide called “${params.slug}”`);
	const all = listGuides();
	const at = all.findIndex((g) => g.slug === guide.slug);
	const link = (g: (typeof all)[number] | undefined) => (g ? { slug: g.slug, title: g.title } : null);
	return { guide, previous: link(all[at - 1]), next: link(all[at + 1]) };
};
