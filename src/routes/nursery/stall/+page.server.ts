import { randomUUID } from 'node:crypto';
import { saleIdSchema, saleSchema } from '$lib/schema/stock';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { runForm } from '$lib/server/forms';
import { nurseryToday, salesService, stockService } from '$lib/server/sale-side';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireUser(event, ...STAFF_ROLES);
	const today = await nurseryToday();
	const [{ days, batches }, day] = await Promise.all([stockService.sellableToday(today), salesService.day(today)]);
	// The form without JavaScript sends this id; with JavaScript each sale makes its own.
	return { name: user.name, today, days, batches, day, clientId: randomUUID(), now: new Date().toISOString() };
};

export const actions: Actions = {
	sell: async (event) => {
		const user = requireUser(event, ...STAFF_ROLES);
		const today = await nurseryToday();
		const { failure, result } = await runForm(event.request, saleSchema, (d) => salesService.record(d, user.id, today));
		return failure ?? { sold: { saleId: result.sale.id, label: `${result.sale.quantity} × ${result.sale.cultivar.name}`, mailed: result.mailed, buyerEmail: result.sale.buyerEmail } };
	},
	undo: async (event) => {
		const user = requireUser(event, ...STAFF_ROLES);
		const { failure, result } = await runForm(event.request, saleIdSchema, (d) => salesService.undo(d.saleId, user.id));
		return failure ?? { undone: `${result.quantity} × ${result.cultivar.name}` };
	}
};
