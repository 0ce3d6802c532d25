/**
 * SvelteKit's own origin check also covers /api/v1, where a cookie-less client sending
 * a non-JSON body must get the API's 400, not a 403. So the check lives here instead:
 * the same rule as the framework's, minus the public API routes that never read the session.
 * Every API route that reads the session cookie (stock, sales, plants) keeps the check.
 */
const FORM_TYPES = ['application/x-www-form-urlencoded', 'multipart/form-data', 'text/plain'];
const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
const COOKIELESS_ROUTES = new Set(['/api/v1/plan-preview', '/api/v1/plan-preview.ics', '/api/v1/cultivars', '/api/v1/climates']);
/**
 * One-click unsubscribe (RFC 8058): mail providers POST from their own servers, with no Origin and
 * no cookies; the token in the path is the only credential and the only effect is fewer e-mails.
 */
const COOKIELESS_PREFIXES = ['/unsubscribe/'];

export function isForbiddenCrossSiteForm(request: Request, url: URL): boolean {
	if (!UNSAFE.has(request.method)) return false;
	if (COOKIELESS_ROUTES.has(url.pathname) || COOKIELESS_PREFIXES.some((p) => url.pathname.startsWith(p))) return false;
	const type = (request.headers.get('content-type') ?? '').split(';', 1)[0].trim().toLowerCase();
	if (!FORM_TYPES.includes(type)) return false;
	return request.headers.get('origin') !== url.origin;
}
