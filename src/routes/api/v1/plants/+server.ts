import { json } from '@sveltejs/kit';
import { plantTableQuerySchema, queryObject } from '$lib/schema/plant-table';
import { apiRoute, parseInput } from '$lib/server/api';
import { requireUser } from '$lib/server/auth';
import { plantTableService } from '$lib/server/plant-table/service';
import type { RequestHandler } from './$types';

/** Staff and the owner: every plant, filtered, sorted and paged. A gardener: only their own. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event);
	const query = parseInput(plantTableQuerySchema, queryObject(event.url.searchParams));
	return json(await plantTableService.list(query, user), { headers: { 'cache-control': 'private, no-store' } });
});
