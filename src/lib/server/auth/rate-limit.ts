import { and, eq, gte, lt, sql } from 'drizzle-orm';
import { db } from '../db';
import { signInAttempts } from '../db/schema';

export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;
/** Failed sign-ins allowed per window: per e-mail (guessing one account) and per address (spraying many). */
export const SIGN_IN_LIMITS = { email: 5, ip: 30 } as const;

export type AttemptKey = { email: string; ip: string };

const keysOf = (k: AttemptKey) => ({ email: `email:${k.email}`, ip: `ip:${k.ip}` });

async function failuresSince(key: string, since: Date): Promise<number> {
	const [row] = await db
		.select({ n: sql<number>`count(*)::int` })
		.from(signInAttempts)
		.where(and(eq(signInAttempts.key, key), gte(signInAttempts.at, since)));
	return row?.n ?? 0;
}

export async function isSignInBlocked(k: AttemptKey, now = new Date()): Promise<boolean> {
	const since = new Date(now.getTime() - SIGN_IN_WINDOW_MS);
	const keys = keysOf(k);
	const [byEmail, byIp] = await Promise.all([failuresSince(keys.email, since), failuresSince(keys.ip, since)]);
	return byEmail >= SIGN_IN_LIMITS.email || byIp >= SIGN_IN_LIMITS.ip;
}

export async function recordSignInFailure(k: AttemptKey): Promise<void> {
	const keys = keysOf(k);
	await db.insert(signInAttempts).values([{ key: keys.email }, { key: keys.ip }]);
	// Old rows are useless; trimming here keeps the table small without a separate job.
	await db.delete(signInAttempts).where(lt(signInAttempts.at, new Date(Date.now() - 24 * 60 * 60 * 1000)));
}

export async function clearSignInFailures(k: AttemptKey): Promise<void> {
	await db.delete(signInAttempts).where(eq(signInAttempts.key, keysOf(k).email));
}
