import type { Cookies } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { lucia, validateSessionCookie, ABSOLUTE_SESSION_LIFETIME_MS } from '../../src/lib/server/auth';
import { db } from '../../src/lib/server/db';
import { sessions, users } from '../../src/lib/server/db/schema';
import { uniqueEmail } from '../helpers/db';

function fakeCookies(value: string): Cookies & { jar: Map<string, string> } {
	const jar = new Map([[lucia.sessionCookieName, value]]);
	return {
		jar,
		get: (name: string) => jar.get(name),
		set: (name: string, v: string) => void jar.set(name, v),
		delete: (name: string) => void jar.delete(name),
		getAll: () => [...jar].map(([name, value]) => ({ name, value })),
		serialize: () => ''
	} as unknown as Cookies & { jar: Map<string, string> };
}

async function person() {
	const [u] = await db.insert(users).values({ email: uniqueEmail('s'), name: 'S', passwordHash: 'x', role: 'gardener' }).returning();
	return u;
}

describe('sessions', () => {
	it('a live session resolves to its user', async () => {
		const u = await person();
		const s = await lucia.createSession(u.id, { createdAt: new Date() });
		const { user } = await validateSessionCookie(fakeCookies(s.id));
		expect(user?.id).toBe(u.id);
		expect(user?.role).toBe('gardener');
	});

	it('ends after the absolute lifetime even while in use (OWASP Session Management: absolute timeout)', async () => {
		const u = await person();
		const s = await lucia.createSession(u.id, { createdAt: new Date() });
		const cookies = fakeCookies(s.id);
		const later = Date.now() + ABSOLUTE_SESSION_LIFETIME_MS + 60_000;
		const { user, session } = await validateSessionCookie(cookies, later);
		expect(user).toBeNull();
		expect(session).toBeNull();
		expect(cookies.jar.get(lucia.sessionCookieName)).toBe('');
		expect(await db.select().from(sessions).where(eq(sessions.id, s.id))).toHaveLength(0);
	});

	it('an unknown session id signs nobody in', async () => {
		const { user } = await validateSessionCookie(fakeCookies('not-a-session'));
		expect(user).toBeNull();
	});
});
