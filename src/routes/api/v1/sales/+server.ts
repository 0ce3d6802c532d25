import { json } from '@sveltejs/kit';
import { saleSchema } from '$lib/schema/stock';
import { apiRoute, parseInput, readJson } from '$lib/server/api';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { nurseryToday, salesService } from '$lib/server/sale-side';
import type { RequestHandler } from './$types';

/** Records a sale: 201 with the sale and its plants' claim links; 200 with the stored one when the client id was seen before. */
export const POST: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event, ...STAFF_ROLES);
	const body = parseInput(saleSchema, await readJson(event.request));
	const { created, sale, plants, mailed } = await salesService.record(body, user.id, await nurseryToday());
	return json({ sale, plants, mailed }, { status: created ? 201 : 200 });
});
