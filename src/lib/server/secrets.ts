/**
 * Server-side secrets. Production reads them from the environment and refuses to start without
 * them; demo and tests generate one on first use and keep it in server_secrets, so the app, the
 * seed script and the tests (separate processes on one database) derive the same claim codes.
 */
import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { serverSecrets } from './db/schema';
import type { Mode } from './config';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type AnyDb = PgDatabase<PgQueryResultHKT, any>;

export const SECRET_MIN_LENGTH = 32;

interface SecretConfig {
	mode: Mode;
	claimSecret: string | null;
}

/** Called when the server starts: production without a usable CLAIM_SECRET does not start. */
export function assertClaimSecret(c: SecretConfig): void {
	if (c.claimSecret !== null && c.claimSecret.length < SECRET_MIN_LENGTH) {
		throw new Error(`CLAIM_SECRET must have at least ${SECRET_MIN_LENGTH} characters (for example: openssl rand -hex 32)`);
	}
	if (c.mode === 'production' && c.claimSecret === null) {
		throw new Error('Set CLAIM_SECRET (at least 32 random characters, e.g. openssl rand -hex 32): it keys the claim codes on care cards');
	}
}

const cache = new WeakMap<object, Promise<string>>();

/** The claim-code key: the configured one, or (outside production) the database's own. */
export function claimSecret(db: AnyDb, c: SecretConfig): Promise<string> {
	assertClaimSecret(c);
	if (c.claimSecret) return Promise.resolve(c.claimSecret);
	let found = cache.get(db);
	if (!found) {
		found = (async () => {
			await db.insert(serverSecrets).values({ name: 'claim', value: randomBytes(32).toString('hex') }).onConflictDoNothing();
			return (await db.select().from(serverSecrets).where(eq(serverSecrets.name, 'claim')))[0].value;
		})();
		found.catch(() => cache.delete(db));
		cache.set(db, found);
	}
	return found;
}
