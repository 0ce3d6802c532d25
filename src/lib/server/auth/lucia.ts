import { DrizzlePostgreSQLAdapter, type PostgreSQLUserTable } from '@lucia-auth/adapter-drizzle';
import { Lucia, TimeSpan } from 'lucia';
import { config } from '../config';
import { db } from '../db';
import { sessions, users } from '../db/schema';
import type { Role } from '../../schema/auth';

/**
 * Over https the cookie carries the __Host- prefix: browsers then insist on Secure, Path=/ and no
 * Domain, so a sibling subdomain cannot plant or overwrite it (ASVS 3.3.1).
 */
export const SESSION_COOKIE = config.secureCookies ? '__Host-bunchline_session' : 'bunchline_session';

export const lucia = new Lucia(new DrizzlePostgreSQLAdapter(
		db,
		sessions,
		// Ids are identity columns the database assigns; the adapter only reads them, so its insert type does not apply.
		users as unknown as PostgreSQLUserTable
	), {
	sessionExpiresIn: new TimeSpan(14, 'd'),
	sessionCookie: {
		name: SESSION_COOKIE,
		attributes: { secure: config.secureCookies, sameSite: 'lax' }
	},
	getUserAttributes: (a) => ({
		email: a.email,
		name: a.name,
		role: a.role,
		units: a.units,
		emailVerified: a.emailVerifiedAt != null
	}),
	getSessionAttributes: (a) => ({ createdAt: a.createdAt })
});

/**
 * Lucia v3 only has a sliding expiry; sessions also end this long after sign-in,
 * whatever the activity (OWASP Session Management Cheat Sheet: absolute timeout).
 */
export const ABSOLUTE_SESSION_LIFETIME_MS = 30 * 24 * 60 * 60 * 1000;

declare module 'lucia' {
	interface Register {
		Lucia: typeof lucia;
		UserId: number;
		DatabaseUserAttributes: {
			email: string;
			name: string;
			role: Role;
			units: 'metric' | 'imperial';
			emailVerifiedAt: Date | null;
		};
		DatabaseSessionAttributes: { createdAt: Date };
	}
}
