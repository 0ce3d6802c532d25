import { asc, desc, eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { climateProfiles, cultivars, nurserySettings } from '../db/schema';
import { readCatalogueVersion } from './version';

export type CultivarRow = typeof cultivars.$inferSelect;
export type ClimateRow = typeof climateProfiles.$inferSelect;
export type SettingsRow = typeof nurserySettings.$inferSelect;

export interface CatalogueRows {
	version: number;
	cultivars: CultivarRow[];
	climates: ClimateRow[];
	settings: SettingsRow | undefined;
}

export const catalogueRepository = {
	version: () => readCatalogueVersion(db),
	/** Everything the catalogue cache holds, read in one snapshot so the version matches the rows. */
	rows: (): Promise<CatalogueRows> =>
		db.transaction(
			async (tx) => ({
				version: await readCatalogueVersion(tx),
				cultivars: await tx.select().from(cultivars).orderBy(asc(cultivars.name)),
				// The nursery's own profiles first (buyers mostly garden near the nursery), then by name.
				climates: await tx.select().from(climateProfiles).orderBy(desc(sql`not ${climateProfiles.builtIn}`), asc(climateProfiles.name)),
				settings: (await tx.select().from(nurserySettings).where(eq(nurserySettings.id, 1)))[0]
			}),
			{ isolationLevel: 'repeatable read', accessMode: 'read only' }
		)
};

export type CatalogueRepository = typeof catalogueRepository;
