// Headers every response carries, pages and static files alike (ASVS 3.4, 14.3.2). Plain
// JavaScript so the production server (scripts/serve.mjs), which also serves /_app and the
// static folder before SvelteKit sees a request, applies the same list as hooks.server.ts.
export const SECURITY_HEADERS = /** @type {const} */ ([
	['X-Content-Type-Options', 'nosniff'],
	['X-Frame-Options', 'DENY'],
	['Referrer-Policy', 'same-origin'],
	['Cross-Origin-Opener-Policy', 'same-origin']
]);

/** Responses that set no caching policy of their own: personal pages must not be kept by browsers or proxies. */
export const DEFAULT_CACHE_CONTROL = 'private, no-store';
