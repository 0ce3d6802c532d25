/**
 * SvelteKit's own origin check also covers /api/v1, where a cookie-less client sending
 * a non-JSON body must get the API's 400, not a 403. So the check lives here instead:
 * the same rule as the framework's, minus the public API, which never reads the session.
 */
const FORM_TYPES = ['application/x-www-form-urlencoded', 'multipart/form-data', 'text/plain'];
const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
/**
 * Only the public endpoints that never read a session are exempt; any other endpoint, under
 * /api/ or not, gets the check, so a cookie-authenticated one cannot be driven by a cross-site form.
 */
export const COOKIELESS_ROUTES = new Set(['/api/v1/plan-preview', '/api/v1/plan-preview.ics', '/api/v1/cultivars', '/api/v1/climates']);

export function isForbiddenCrossSiteForm(request: Request, url: URL): boolean {
	if (!UNSAFE.has(request.method)) return false;
	if (COOKIELESS_ROUTES.has(url.pathname)) return false;
	const type = (request.headers.get('content-type') ?? '').split(';', 1)[0].trim().toLowerCase();
	if (!FORM_TYPES.includes(type)) return false;
	return request.headers.get('origin') !== url.origin;
}
