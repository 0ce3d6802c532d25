import { text, type Handle, type ServerInit } from '@sveltejs/kit';
import { validateSessionCookie } from '$lib/server/auth';
import { config } from '$lib/server/config';
import { isForbiddenCrossSiteForm } from '$lib/server/csrf';
import { assertClaimSecret } from '$lib/server/secrets';

/** In production, e-mailed links and the origin check need the public URL: refuse to start without it. */
export const init: ServerInit = () => {
	if (config.mode === 'production' && !process.env.ORIGIN && !process.env.PUBLIC_URL) {
		throw new Error('Set ORIGIN to the public URL of this site (for example ORIGIN=https://plants.example.org)');
	}
	assertClaimSecret(config);
};

export const handle: Handle = async ({ event, resolve }) => {
	if (isForbiddenCrossSiteForm(event.request, event.url)) {
		return text(`Cross-site ${event.request.method} form submissions are forbidden`, { status: 403 });
	}
	const { user, session } = await validateSessionCookie(event.cookies);
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
	response.headers.set('X-Content-Type-Options', 'nosniff');
	response.headers.set('Referrer-Policy', 'same-origin');
	response.headers.set('X-Frame-Options', 'DENY');
	return response;
}
