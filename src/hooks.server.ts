import { text, type Handle, type ServerInit } from '@sveltejs/kit';
import { validateSessionCookie } from '$lib/server/auth';
import { assertReadyToServe, config } from '$lib/server/config';
import { isForbiddenCrossSiteForm } from '$lib/server/csrf';
import { closeDb } from '$lib/server/db';
import { stopJobs } from '$lib/server/jobs';
import { publicApiLimit, publicFormLimit } from '$lib/server/api-limit';
import { DEFAULT_CACHE_CONTROL, SECURITY_HEADERS } from '$lib/server/security-headers.js';
import { assertClaimSecret } from '$lib/server/secrets';

export const init: ServerInit = () => {
	assertReadyToServe();
	// The production server (scripts/serve.mjs, or adapter-node's own) emits this once it has
	// stopped taking requests: end the pool and the queue so the process can exit.
	process.once('sveltekit:shutdown' as 'exit', async () => {
		await Promise.allSettled([stopJobs(), closeDb()]);
	});
	assertClaimSecret(config);
};

export const handle: Handle = async ({ event, resolve }) => {
	if (isForbiddenCrossSiteForm(event.request, event.url)) {
		return text(`Cross-site ${event.request.method} form submissions are forbidden`, { status: 403 });
	}
	const limited = publicApiLimit(event);
	if (limited) return withHeaders(limited);
	const { user, session } = await validateSessionCookie(event.cookies);
	const formsLimited = publicFormLimit(event, Boolean(user));
	if (formsLimited) return withHeaders(formsLimited);
	event.locals.user = user;
	event.locals.session = session;
	const response = await resolve(event);
	// Only the HTML document carries the 400; the client router's data requests must stay 200.
	if (event.locals.invalidInput && !event.isDataRequest && response.status === 200) {
		return withHeaders(new Response(response.body, { status: 400, headers: response.headers }));
	}
	return withHeaders(response);
};

function withHeaders(response: Response): Response {
	for (const [name, value] of SECURITY_HEADERS) response.headers.set(name, value);
	// Pages show personal data (the team, the mailbox, a reset form with its token): never stored.
	if (!response.headers.has('cache-control')) response.headers.set('cache-control', DEFAULT_CACHE_CONTROL);
	return response;
}
