/** Requests against the running production build, as an attacker (or a browser) would send them. */
import { baseUrl } from '../helpers/browser';

export { baseUrl };

export const get = (path: string, cookie?: string, headers: Record<string, string> = {}) =>
	fetch(`${baseUrl()}${path}`, { redirect: 'manual', headers: { ...headers, ...(cookie ? { cookie } : {}) } });

/** A same-site form post (the Origin header a browser sends), answered as HTML. */
export const postForm = (path: string, fields: Record<string, string>, cookie?: string) =>
	fetch(`${baseUrl()}${path}`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: baseUrl(), ...(cookie ? { cookie } : {}) },
		body: new URLSearchParams(fields)
	});

export const sessionCookieOf = (res: Response) => res.headers.getSetCookie().find((c) => /^(__Host-)?bunchline_session=[^;]/.test(c));

/** Signs in through the form and returns the cookie header value for later requests. */
export async function signedIn(email: string, password: string, cookie?: string): Promise<string> {
	const res = await postForm('/login?/signin', { email, password }, cookie);
	const set = sessionCookieOf(res);
	if (!set) throw new Error(`no session for ${email} (${res.status})`);
	return set.split(';')[0];
}
