import type { Cookies } from '@sveltejs/kit';
import type { Cookie, Session, User } from 'lucia';
import { ABSOLUTE_SESSION_LIFETIME_MS, lucia } from './lucia';

function setCookie(cookies: Cookies, cookie: Cookie) {
	cookies.set(cookie.name, cookie.value, { ...cookie.attributes, path: '/' });
}

export async function validateSessionCookie(
	cookies: Cookies,
	now = Date.now()
): Promise<{ user: User | null; session: Session | null }> {
	const sessionId = cookies.get(lucia.sessionCookieName);
	if (!sessionId) return { user: null, session: null };
	const { session, user } = await lucia.validateSession(sessionId);
	if (session && now - session.createdAt.getTime() > ABSOLUTE_SESSION_LIFETIME_MS) {
		await lucia.invalidateSession(session.id);
		setCookie(cookies, lucia.createBlankSessionCookie());
		return { user: null, session: null };
	}
	if (session?.fresh) setCookie(cookies, lucia.createSessionCookie(session.id));
	if (!session) setCookie(cookies, lucia.createBlankSessionCookie());
	return { user, session };
}

/**
 * A new session always replaces the one the browser held (ASVS 7.2.4): signing in again, or as
 * someone else, ends the earlier session instead of leaving it valid.
 */
export async function startSession(cookies: Cookies, userId: number): Promise<void> {
	const previous = cookies.get(lucia.sessionCookieName);
	if (previous) await lucia.invalidateSession(previous);
	const session = await lucia.createSession(userId, { createdAt: new Date() });
	setCookie(cookies, lucia.createSessionCookie(session.id));
}

export async function endSession(cookies: Cookies, sessionId: string): Promise<void> {
	await lucia.invalidateSession(sessionId);
	setCookie(cookies, lucia.createBlankSessionCookie());
}

/** Every session of the user ends, e.g. when the password changes. */
export function endAllSessions(userId: number): Promise<void> {
	return lucia.invalidateUserSessions(userId);
}

/** Every session of the user but the one in use, e.g. after a password change made in it. */
export async function endOtherSessions(userId: number, keepSessionId: string): Promise<void> {
	for (const s of await lucia.getUserSessions(userId)) if (s.id !== keepSessionId) await lucia.invalidateSession(s.id);
}
