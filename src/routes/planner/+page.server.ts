import { catalogueService } from '$lib/server/catalogue/service';
import { plannerView } from '$lib/server/plan-preview';
import type { PageServerLoad } from './$types';

// Public: the year planner is the nursery's open tool; it reads only the query string and stores nothing.
export const load: PageServerLoad = async ({ url, locals }) => {
	const view = plannerView(url.searchParams, await catalogueService.snapshot());
	if (Object.keys(view.errors).length > 0) locals.invalidInput = true;
	return view;
};
