import { plantTableQuerySchema, queryObject } from '$lib/schema/plant-table';
import { apiRoute, parseInput } from '$lib/server/api';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { csvStream } from '$lib/server/csv';
import { plantTableService } from '$lib/server/plant-table/service';
import type { RequestHandler } from './$types';

/** Every plant matching the table's filters, in its sort order, streamed: not just the page shown. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event, ...STAFF_ROLES);
	// Paging is ignored, but a bad value is still named rather than silently dropped.
	const filters = parseInput(plantTableQuerySchema, queryObject(event.url.searchParams));
	const { header, batches, day } = await plantTableService.export(filters, user);
	return new Response(csvStream(header, batches), {
		headers: {
			'content-type': 'text/csv; charset=utf-8',
			'content-disposition': `attachment; filename="bunchline-plants-${day}.csv"`,
			'cache-control': 'private, no-store',
			'x-content-type-options': 'nosniff'
		}
	});
});
