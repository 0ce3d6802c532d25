import { fieldErrors } from '$lib/schema/form';
import { searchSchema } from '$lib/schema/guides';
import { searchService } from '$lib/server/search/service';
import type { PageServerLoad } from './$types';

// Public: anyone may search published guides and public answers; staff results also cover private questions.
export const load: PageServerLoad = async (event) => {
	const raw = event.url.searchParams.get('q');
	if (raw === null) return { q: '', results: null, errors: {} as Record<string, string>, page: 1 };
	const parsed = searchSchema.safeParse({ q: raw, page: event.url.searchParams.get('page') ?? undefined });
	if (!parsed.success) {
		event.locals.invalidInput = true;
		return { q: raw.slice(0, 200), results: null, errors: fieldErrors(parsed.error), page: 1 };
	}
	const results = await searchService.search(parsed.data.q, event.locals.user ?? null, parsed.data.page);
	return { q: parsed.data.q, results, errors: {} as Record<string, string>, page: parsed.data.page };
};
