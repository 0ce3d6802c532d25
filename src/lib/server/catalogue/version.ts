/**
 * The catalogue version: one counter raised in the transaction of every write to cultivars,
 * climate profiles or the nursery settings. Takes the database as a parameter (no client import),
 * so scripts with their own connection can call it too.
 */
import { eq, sql } from 'drizzle-orm';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { catalogueVersion } from '../db/schema';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type AnyDb = PgDatabase<PgQueryResultHKT, any>;

/**
 * Raises the version. The in-memory caches of every app instance re-read the catalogue when the
 * number moves, and, because it moves inside the writer's transaction, only after it committed.
 */
export async function bumpCatalogueVersion(tx: AnyDb): Promise<void> {
	await tx
		.insert(catalogueVersion)
		.values({ id: 1, version: 1 })
		.onConflictDoUpdate({ target: catalogueVersion.id, set: { version: sql`${catalogueVersion.version} + 1`, changedAt: sql`now()` } });
}

export async function readCatalogueVersion(d: AnyDb): Promise<number> {
	return (await d.select({ version: catalogueVersion.version }).from(catalogueVersion).where(eq(catalogueVersion.id, 1)))[0]?.version ?? 0;
}
