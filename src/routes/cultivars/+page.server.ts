import { waitlistSchema } from '$lib/schema/stock';
import { runForm } from '$lib/server/forms';
import { stockService, waitlistService } from '$lib/server/sale-side';
import type { Actions, PageServerLoad } from './$types';

// Public: what the nursery sells and whether it is in stock is for anyone deciding what to buy.
export const load: PageServerLoad = async () => ({ cultivars: await stockService.cultivarsWithStock() });

export const actions: Actions = {
	// Public: anyone may ask to hear once when a sold-out cultivar is back; mails to one address are limited.
	wait: async ({ request }) => {
		const inStock = async (id: number) => ((await stockService.cultivarsWithStock()).find((c) => c.id === id)?.onHand ?? 0) > 0;
		const { failure, result } = await runForm(request, waitlistSchema, (d) => waitlistService.join(d, inStock));
		return failure ?? { waiting: { cultivar: result.cultivarName, leave: `/cultivars/leave?token=${result.token}` } };
	}
};
