import { json } from '@sveltejs/kit';
import { catalogue } from '$lib/server/plan-preview';
import type { RequestHandler } from './$types';

// Public: climate profiles are reference data the year planner offers to everyone.
export const GET: RequestHandler = () => json({ climates: catalogue.climates }, { headers: { 'cache-control': 'public, max-age=3600' } });
