import { json } from '@sveltejs/kit';
import { saleIdSchema } from '$lib/schema/stock';
import { apiRoute, parseInput } from '$lib/server/api';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { salesService } from '$lib/server/sale-side';
import type { RequestHandler } from './$types';

/** Undoes a sale within the undo window: its plants go back on the batch. */
export const DELETE: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event, ...STAFF_ROLES);
	const { saleId } = parseInput(saleIdSchema, { saleId: event.params.id });
	return json({ sale: await salesService.undo(saleId, user.id) });
});
