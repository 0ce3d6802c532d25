import { json } from '@sveltejs/kit';
import { planBodySchema } from '$lib/schema/plan';
import { apiRoute, parseInput, readJson } from '$lib/server/api';
import { catalogueService } from '$lib/server/catalogue/service';
import { previewPlan } from '$lib/server/plan-preview';
import type { RequestHandler } from './$types';

// Public: a preview computes a plan from the request alone; nothing is stored or tied to an account.
export const POST: RequestHandler = apiRoute(async ({ request }) => {
	const body = parseInput(planBodySchema, await readJson(request));
	return json({ steps: previewPlan(body, await catalogueService.snapshot()).plan.steps });
});
