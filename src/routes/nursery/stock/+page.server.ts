import { adjustSchema, marketDaySchema, moveSchema, receiveSchema } from '$lib/schema/stock';
import { pageQuery } from '$lib/schema/paging';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { catalogueService } from '$lib/server/catalogue/service';
import { runForm } from '$lib/server/forms';
import { nurseryToday, stockService } from '$lib/server/sale-side';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireUser(event, ...STAFF_ROLES);
	const today = await nurseryToday();
	const { page, size } = pageQuery(event.url);
	const [{ batches, total }, days, cultivars] = await Promise.all([
		stockService.page(size, (page - 1) * size, today),
		stockService.marketDays(today),
		catalogueService.cultivars()
	]);
	const asked = Number(event.url.searchParams.get('day'));
	const dayId = [...days.upcoming, ...days.past].find((d) => d.id === asked)?.id ?? days.upcoming[0]?.id ?? days.past[0]?.id ?? null;
	const report = dayId === null ? null : await stockService.dayReport(dayId, today);
	return {
		today,
		isOwner: user.role === 'owner',
		batches,
		total,
		page,
		size,
		days,
		report,
		cultivars: cultivars.map((c) => ({ slug: c.cultivar.slug, name: c.cultivar.name }))
	};
};

export const actions: Actions = {
	receive: async (event) => {
		const user = requireUser(event, 'owner');
		const today = await nurseryToday();
		const { failure, result } = await runForm(event.request, receiveSchema, (d) => stockService.receive(d, user.id, today));
		return failure ?? { done: `Received ${result.onHand} × ${result.cultivar.name}` };
	},
	adjust: async (event) => {
		const user = requireUser(event, ...STAFF_ROLES);
		const today = await nurseryToday();
		const { failure, result } = await runForm(event.request, adjustSchema, (d) => stockService.adjust(d, user.id, today));
		return failure ?? { done: `${result.cultivar.name}: ${result.onHand} on hand now` };
	},
	move: async (event) => {
		const user = requireUser(event, ...STAFF_ROLES);
		const { failure, result } = await runForm(event.request, moveSchema, async (d) => (await stockService.move(d, user.id), d));
		return failure ?? { done: `Moved ${result.count} ${result.count === 1 ? 'plant' : 'plants'} ${result.to === null ? 'back to the nursery' : 'to the market day'}` };
	},
	marketDay: async (event) => {
		requireUser(event, ...STAFF_ROLES);
		const { failure, result } = await runForm(event.request, marketDaySchema, (d) => stockService.addMarketDay(d));
		return failure ?? { done: `Market day added: ${result.place}` };
	}
};
