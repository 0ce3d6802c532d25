import { json } from '@sveltejs/kit';
import { catalogueService } from '$lib/server/catalogue/service';
import type { RequestHandler } from './$types';

// Public: the cultivar catalogue is the nursery's published reference, needed before anyone signs in.
export const GET: RequestHandler = async () =>
	json({ cultivars: (await catalogueService.cultivars()).map((c) => c.cultivar) }, { headers: { 'cache-control': 'public, max-age=60' } });
