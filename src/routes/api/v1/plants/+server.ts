import { json } from '@sveltejs/kit';
import { pageQuery } from '$lib/schema/paging';
import { apiRoute } from '$lib/server/api';
import { requireUser } from '$lib/server/auth';
import { nurseryToday, plantsService } from '$lib/server/sale-side';
import { scopeFor } from '$lib/server/plants/service';
import type { RequestHandler } from './$types';

/** Plants, a page at a time: staff and the owner see all, a gardener their own. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event);
	return json(await plantsService.page(scopeFor(user), pageQuery(event.url), await nurseryToday()));
});
