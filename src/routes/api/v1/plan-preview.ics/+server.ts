import { planQuerySchema, queryValues } from '$lib/schema/plan';
import { apiRoute, parseInput } from '$lib/server/api';
import { icsResponse } from '$lib/server/calendar';
import { catalogueService } from '$lib/server/catalogue/service';
import { previewCalendar } from '$lib/server/plan-preview';
import type { RequestHandler } from './$types';

// Public: calendar apps fetch subscriptions without cookies, and the feed holds only what its URL says.
export const GET: RequestHandler = apiRoute(async ({ url }) => {
	const request = parseInput(planQuerySchema, queryValues(url.searchParams));
	return icsResponse(previewCalendar(request, await catalogueService.snapshot(), url.origin));
});
