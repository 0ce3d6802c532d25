/**
 * Writes the engine's built-in cultivars and climates into the catalogue tables: missing ones are
 * added, existing built-in rows follow the engine except where the nursery set its own value.
 * Runs after every migration (npm start and the tests), so every database has the catalogue.
 * Takes the database as a parameter: scripts call it with their own connection.
 */
import { isDeepStrictEqual } from 'node:util';
import { and, eq } from 'drizzle-orm';
import { climates as engineClimates, cultivars as engineCultivars } from '../../care';
import { climateProfiles, cultivars } from '../db/schema';
import { climateToRow, cultivarToRow, mergeBuiltInParameters } from './mapping';
import { bumpCatalogueVersion, type AnyDb } from './version';

export async function syncBuiltInCatalogue(db: AnyDb): Promise<void> {
	await db.transaction(async (tx) => {
		let changed = false;
		const stored = new Map((await tx.select().from(cultivars).where(eq(cultivars.builtIn, true))).map((r) => [r.slug, r]));
		for (const c of engineCultivars) {
			const row = cultivarToRow(c);
			const existing = stored.get(c.slug);
			if (!existing) {
				const added = await tx.insert(cultivars).values({ ...row, builtIn: true }).onConflictDoNothing({ target: cultivars.slug }).returning({ id: cultivars.id });
				changed ||= added.length > 0;
				continue;
			}
			const parameters = mergeBuiltInParameters(existing.parameters, row.parameters);
			if (!isDeepStrictEqual(parameters, existing.parameters)) {
				await tx.update(cultivars).set({ parameters, updatedAt: new Date() }).where(eq(cultivars.id, existing.id));
				changed = true;
			}
		}
		const storedClimates = new Map((await tx.select().from(climateProfiles).where(eq(climateProfiles.builtIn, true))).map((r) => [r.slug, r]));
		for (const c of engineClimates) {
			const row = climateToRow(c);
			const existing = storedClimates.get(c.slug);
			if (!existing) {
				const added = await tx.insert(climateProfiles).values({ ...row, builtIn: true }).onConflictDoNothing({ target: climateProfiles.slug }).returning({ id: climateProfiles.id });
				changed ||= added.length > 0;
			} else if (!isDeepStrictEqual(climateToRow(existing), row)) {
				await tx
					.update(climateProfiles)
					.set({ name: row.name, monthlyMeanC: row.monthlyMeanC, source: row.source, updatedAt: new Date() })
					.where(and(eq(climateProfiles.id, existing.id), eq(climateProfiles.builtIn, true)));
				changed = true;
			}
		}
		if (changed) await bumpCatalogueVersion(tx);
	});
}
