import { pageQuery } from '$lib/schema/paging';
import { requireUser } from '$lib/server/auth';
import { nurseryToday, plantsService } from '$lib/server/sale-side';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireUser(event);
	const today = await nurseryToday();
	// "My plants" is always one's own, whatever the role; the nursery's table shows everyone's.
	const list = await plantsService.page({ kind: 'gardener', gardenerId: user.id }, pageQuery(event.url), today);
	const claimed = Number(event.url.searchParams.get('claimed')) || null;
	return { name: user.name, today, ...list, claimed: list.plants.find((p) => p.id === claimed)?.cultivar.name ?? null };
};
