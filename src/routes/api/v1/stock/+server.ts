import { json } from '@sveltejs/kit';
import { pageQuery } from '$lib/schema/paging';
import { receiveSchema } from '$lib/schema/stock';
import { apiRoute, parseInput, readJson } from '$lib/server/api';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { nurseryToday, stockService } from '$lib/server/sale-side';
import type { RequestHandler } from './$types';

/** Batches with plants on hand, a page at a time. */
export const GET: RequestHandler = apiRoute(async (event) => {
	requireUser(event, ...STAFF_ROLES);
	const { page, size } = pageQuery(event.url);
	const { batches, total } = await stockService.page(size, (page - 1) * size, await nurseryToday());
	return json({ batches, page, size, total });
});

/** Receives a batch (owner). */
export const POST: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event, 'owner');
	const body = parseInput(receiveSchema, await readJson(event.request));
	return json({ batch: await stockService.receive(body, user.id, await nurseryToday()) }, { status: 201 });
});
