import { json } from '@sveltejs/kit';
import { previewSchema } from '$lib/schema/guides';
import { apiRoute, parseInput, readJson } from '$lib/server/api';
import { requireUser } from '$lib/server/auth';
import { renderMarkdown } from '$lib/server/markdown';
import type { RequestHandler } from './$types';

/** Live preview for every Markdown field: the same pipeline that renders what is stored. Signed-in people only. */
export const POST: RequestHandler = apiRoute(async (event) => {
	requireUser(event);
	const { markdown } = parseInput(previewSchema, await readJson(event.request));
	return json({ html: renderMarkdown(markdown) });
});
