import { plannerView } from '$lib/server/plan-preview';
import type { PageServerLoad } from './$types';

// Public: the year planner is the nursery's open tool; it reads only the query string and stores nothing.
export const load: PageServerLoad = ({ url }) => plannerView(url.searchParams);
