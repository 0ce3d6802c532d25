import { json } from '@sveltejs/kit';
import { newFeedSchema } from '$lib/schema/delivery';
import { apiRoute, parseInput, readJson } from '$lib/server/api';
import { requireUser } from '$lib/server/auth';
import { feeds } from '$lib/server/feeds/service';
import type { RequestHandler } from './$types';

/** The signed-in gardener's live feeds, without their tokens (a URL is shown once, at creation). */
export const GET: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event);
	return json({ feeds: await feeds.list(user.id) });
});

/** `{ plantId? }`: a feed of one plant, or of all the gardener's plants. Answers `{ id, url, webcal }`. */
export const POST: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event);
	const input = parseInput(newFeedSchema, await readJson(event.request));
	const feed = await feeds.create(user.id, input.plantId);
	return json({ id: feed.id, url: feed.https, webcal: feed.webcal }, { status: 201 });
});
