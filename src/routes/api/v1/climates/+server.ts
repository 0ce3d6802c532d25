import { json } from '@sveltejs/kit';
import { catalogueService } from '$lib/server/catalogue/service';
import type { RequestHandler } from './$types';

// Public: climate profiles are reference data the year planner offers to everyone.
export const GET: RequestHandler = async () =>
	json({ climates: (await catalogueService.climates()).map((c) => c.climate) }, { headers: { 'cache-control': 'public, max-age=60' } });
