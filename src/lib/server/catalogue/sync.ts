/**
 * Writes the engine's built-in cultivars and climates into the catalogue tables: missing ones are
 * added, existing built-in rows follow the engine except where the nursery set its own value.
 * Runs after every migration (npm start and the tests), so every database has the catalogue.
 * Takes the database as a parameter: scripts call it with their own connection.
 */
import { eq } from 'drizzle-orm';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { climates as engineClimates, cultivars as engineCultivars } from '../../care';
import { climateProfiles, cultivars } from '../db/schema';
import { climateToRow, cultivarToRow, mergeBuiltInParameters } from './mapping';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyDb = PgDatabase<PgQueryResultHKT, any>;

export async function syncBuiltInCatalogue(db: AnyDb): Promise<void> {
	await db.transaction(async (tx) => {
		const stored = new Map((await tx.select().from(cultivars).where(eq(cultivars.builtIn, true))).map((r) => [r.slug, r]));
		for (const c of engineCultivars) {
			const row = cultivarToRow(c);
			const existing = stored.get(c.slug);
			if (!existing) {
				await tx.insert(cultivars).values({ ...row, builtIn: true }).onConflictDoNothing({ target: cultivars.slug });
				continue;
			}
			const parameters = mergeBuiltInParameters(existing.parameters, row.parameters);
			if (JSON.stringify(parameters) !== JSON.stringify(existing.parameters))
				await tx.update(cultivars).set({ parameters }).where(eq(cultivars.id, existing.id));
		}
		for (const c of engineClimates) {
			const row = climateToRow(c);
			await tx
				.insert(climateProfiles)
				.values({ ...row, builtIn: true })
				.onConflictDoUpdate({ target: climateProfiles.slug, set: { name: row.name, monthlyMeanC: row.monthlyMeanC, source: row.source }, setWhere: eq(climateProfiles.builtIn, true) });
		}
	});
}
