import { feeds } from '$lib/server/feeds/service';
import type { RequestHandler } from './$types';

// Public: calendar apps poll without cookies; the unguessable token is the credential, and an unknown or revoked one is 404.
export const GET: RequestHandler = async ({ params, request }) => {
	const answer = await feeds.fetch(params.token, request.headers.get('if-none-match'), request.headers.get('if-modified-since'));
	return new Response(answer.status === 404 ? 'No such calendar' : (answer.body ?? null), { status: answer.status, headers: answer.headers });
};
