import { asc, eq, isNull } from 'drizzle-orm';
import { db } from '../db';
import { climateProfiles, cultivars } from '../db/schema';

export const catalogueRepository = {
	cultivars: (includeRetired = false) =>
		db
			.select()
			.from(cultivars)
			.where(includeRetired ? undefined : isNull(cultivars.retiredAt))
			.orderBy(asc(cultivars.name)),
	cultivarBySlug: async (slug: string) => (await db.select().from(cultivars).where(eq(cultivars.slug, slug)))[0],
	cultivarById: async (id: number) => (await db.select().from(cultivars).where(eq(cultivars.id, id)))[0],
	climates: () => db.select().from(climateProfiles).orderBy(asc(climateProfiles.builtIn), asc(climateProfiles.name)),
	climateBySlug: async (slug: string) => (await db.select().from(climateProfiles).where(eq(climateProfiles.slug, slug)))[0],
	climateById: async (id: number) => (await db.select().from(climateProfiles).where(eq(climateProfiles.id, id)))[0]
};

export type CatalogueRepository = typeof catalogueRepository;
export type CultivarRow = typeof cultivars.$inferSelect;
export type ClimateRow = typeof climateProfiles.$inferSelect;
