/** Queries behind the owner's catalogue and settings pages. Queries only: the rules are in editor.ts. */
import { and, count, desc, eq, ne } from 'drizzle-orm';
import { db } from '../db';
import type { Conn, Tx } from '../db/tx';
import { climateProfiles, cultivarChanges, cultivars, nurserySettings, plants, users } from '../db/schema';
import { bumpCatalogueVersion } from './version';

type CultivarInsert = typeof cultivars.$inferInsert;
type ClimateInsert = typeof climateProfiles.$inferInsert;
type SettingsInsert = typeof nurserySettings.$inferInsert;
export type ChangeInsert = typeof cultivarChanges.$inferInsert;

export const editingRepository = {
	transaction: <T>(work: (tx: Tx) => Promise<T>) => db.transaction(work),
	bumpVersion: (tx: Tx) => bumpCatalogueVersion(tx),

	lockCultivar: async (tx: Tx, slug: string) => (await tx.select().from(cultivars).where(eq(cultivars.slug, slug)).for('update'))[0],
	cultivarSlugTaken: async (c: Conn, slug: string) => (await c.select({ id: cultivars.id }).from(cultivars).where(eq(cultivars.slug, slug))).length > 0,
	insertCultivar: async (tx: Tx, values: CultivarInsert) => (await tx.insert(cultivars).values(values).returning())[0]!,
	updateCultivar: (tx: Tx, id: number, values: Partial<CultivarInsert>) => tx.update(cultivars).set({ ...values, updatedAt: new Date() }).where(eq(cultivars.id, id)),
	insertChanges: async (tx: Tx, rows: ChangeInsert[]) => {
		if (rows.length > 0) await tx.insert(cultivarChanges).values(rows);
	},
	historyCount: async (cultivarId: number) => (await db.select({ n: count() }).from(cultivarChanges).where(eq(cultivarChanges.cultivarId, cultivarId)))[0]!.n,
	history: (cultivarId: number, limit: number, offset: number) =>
		db
			.select({ id: cultivarChanges.id, field: cultivarChanges.field, oldValue: cultivarChanges.oldValue, newValue: cultivarChanges.newValue, at: cultivarChanges.at, by: users.name })
			.from(cultivarChanges)
			.leftJoin(users, eq(users.id, cultivarChanges.userId))
			.where(eq(cultivarChanges.cultivarId, cultivarId))
			.orderBy(desc(cultivarChanges.at), desc(cultivarChanges.id))
			.limit(limit)
			.offset(offset),
	plantsOfCultivar: async (cultivarId: number) => (await db.select({ n: count() }).from(plants).where(eq(plants.cultivarId, cultivarId)))[0]!.n,

	lockClimate: async (tx: Tx, slug: string) => (await tx.select().from(climateProfiles).where(eq(climateProfiles.slug, slug)).for('update'))[0],
	climateSlugTaken: async (c: Conn, slug: string) => (await c.select({ id: climateProfiles.id }).from(climateProfiles).where(eq(climateProfiles.slug, slug))).length > 0,
	climateNameTaken: async (c: Conn, name: string, exceptId = 0) =>
		(await c.select({ id: climateProfiles.id }).from(climateProfiles).where(and(eq(climateProfiles.name, name), ne(climateProfiles.id, exceptId)))).length > 0,
	insertClimate: async (tx: Tx, values: ClimateInsert) => (await tx.insert(climateProfiles).values(values).returning())[0]!,
	updateClimate: (tx: Tx, id: number, values: Partial<ClimateInsert>) => tx.update(climateProfiles).set({ ...values, updatedAt: new Date() }).where(eq(climateProfiles.id, id)),
	deleteClimate: (tx: Tx, id: number) => tx.delete(climateProfiles).where(eq(climateProfiles.id, id)),
	plantsInClimate: async (climateId: number, c: Conn = db) => (await c.select({ n: count() }).from(plants).where(eq(plants.climateProfileId, climateId)))[0]!.n,
	/** The settings row, locked, so a climate cannot stop being the default while it is deleted. */
	lockSettings: async (tx: Tx) => (await tx.select().from(nurserySettings).where(eq(nurserySettings.id, 1)).for('update'))[0],
	saveSettings: (tx: Tx, values: Omit<SettingsInsert, 'id'>) =>
		tx
			.insert(nurserySettings)
			.values({ id: 1, ...values })
			.onConflictDoUpdate({ target: nurserySettings.id, set: { ...values, updatedAt: new Date() } })
};

export type EditingRepository = typeof editingRepository;
