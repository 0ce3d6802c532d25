import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiRoute, parseInput } from '$lib/server/api';
import { requireUser } from '$lib/server/auth';
import { nurseryToday, plantsService } from '$lib/server/sale-side';
import { scopeFor } from '$lib/server/plants/service';
import type { RequestHandler } from './$types';

const params = z.object({ id: z.coerce.number({ error: 'Give a plant id' }).int('Give a plant id').positive('Give a plant id') });

/** One plant; 404 when it does not exist or (for a gardener) is someone else's. */
export const GET: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event);
	const { id } = parseInput(params, event.params);
	return json({ plant: await plantsService.one(scopeFor(user), id, await nurseryToday()) });
});
