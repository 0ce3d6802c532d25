import { nurseryService } from '$lib/server/nursery/service';
import { plannerView, todayIso } from '$lib/server/plan-preview';
import type { PageServerLoad } from './$types';

// Public: the year planner is the nursery's open tool; it reads only the query string and stores nothing.
export const load: PageServerLoad = async ({ url, locals }) => {
	const { feeding, timeZone } = await nurseryService.planningContext();
	const view = plannerView(url.searchParams, todayIso(new Date(), timeZone), feeding);
	if (Object.keys(view.errors).length > 0) locals.invalidInput = true;
	return view;
};
