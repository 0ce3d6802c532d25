import { DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { baseUrl } from './browser';

/** Signs a demo account in through the form and returns its session cookie ("name=value"). */
export async function sessionCookie(email: string, password = DEMO_PASSWORD): Promise<string> {
	const login = await fetch(`${baseUrl()}/login?/signin`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', origin: baseUrl() },
		body: new URLSearchParams({ email, password })
	});
	const cookie = login.headers.getSetCookie().find((c) => c.startsWith('bunchline_session='));
	if (!cookie) throw new Error(`no session for ${email} (${login.status})`);
	return cookie.split(';')[0]!;
}
