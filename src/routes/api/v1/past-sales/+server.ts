import { json } from '@sveltejs/kit';
import { IMPORT_MAX_BYTES } from '$lib/schema/past-sales';
import { ApiInputError, apiError, apiRoute } from '$lib/server/api';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { pastSalesImport } from '$lib/server/plant-table/past-sales-instance';
import type { RequestHandler } from './$types';

const tooLarge = () =>
	apiError('The file is too large', [{ path: [], message: `Import at most ${IMPORT_MAX_BYTES / 1024} KB (about 6,000 rows) at a time: split the file` }], 413);

/**
 * Past sales as CSV (Content-Type text/csv, which a cross-site form cannot send). All rows or
 * none: 400 lists every bad row and column; 201 says how many sales were written.
 */
export const POST: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event, ...STAFF_ROLES);
	const type = event.request.headers.get('content-type') ?? '';
	if (!/^text\/csv\s*(;|$)/i.test(type)) throw new ApiInputError('Send the file as CSV', [{ path: [], message: 'Content-Type must be text/csv' }]);
	if (Number(event.request.headers.get('content-length') ?? 0) > IMPORT_MAX_BYTES) return tooLarge();
	const body = await event.request.arrayBuffer();
	if (body.byteLength > IMPORT_MAX_BYTES) return tooLarge();
	const text = new TextDecoder('utf-8', { fatal: false }).decode(body);
	return json(await pastSalesImport.run(text, user.id), { status: 201 });
});
