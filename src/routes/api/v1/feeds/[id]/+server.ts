import { feedIdSchema } from '$lib/schema/delivery';
import { apiRoute, parseInput } from '$lib/server/api';
import { requireUser } from '$lib/server/auth';
import { feeds } from '$lib/server/feeds/service';
import type { RequestHandler } from './$types';

/** Revokes a feed: its URL answers 404 from now on. */
export const DELETE: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event);
	const { id } = parseInput(feedIdSchema, event.params);
	await feeds.revoke(user.id, id);
	return new Response(null, { status: 204 });
});
