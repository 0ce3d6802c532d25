import { DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { baseUrl } from './browser';

/** Signs in over HTTP and returns the session cookie ("name=value"). */
export async function sessionCookie(email: string, password = DEMO_PASSWORD): Promise<string> {
	const login = await fetch(`${baseUrl()}/login?/signin`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', origin: baseUrl() },
		body: new URLSearchParams({ email, password })
	});
	const cookie = login.headers.getSetCookie().find((c) => c.startsWith('bunchline_session='));
	if (!cookie) throw new Error(`no session for ${email} (${login.status})`);
	return cookie.split(';')[0];
}

/** A form post as a browser would send it (same origin), without following redirects. */
export function postForm(path: string, fields: Record<string, string | string[]>, cookie = ''): Promise<Response> {
	const body = new URLSearchParams();
	for (const [k, v] of Object.entries(fields)) for (const one of Array.isArray(v) ? v : [v]) body.append(k, one);
	return fetch(`${baseUrl()}${path}`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: baseUrl(), ...(cookie ? { cookie } : {}) },
		body
	});
}
