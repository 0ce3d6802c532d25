/** Queries of the plant page, the milestone log and their API. Queries only. */
import { and, asc, eq } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db } from '../db';
import { climateProfiles, cultivars, milestones, planSteps, plants, users } from '../db/schema';
import type { Conn } from '../db/tx';

export type MilestoneRow = typeof milestones.$inferSelect;
export type PlantRow = typeof plants.$inferSelect;

const parent = alias(plants, 'parent');
const parentCultivar = alias(cultivars, 'parent_cultivar');

export const plantRepository = {
	connection: db as Conn,
	transaction: <T>(fn: (tx: Parameters<Parameters<typeof db.transaction>[0]>[0]) => Promise<T>) => db.transaction(fn),

	/** The plant with the names the page shows. */
	plant: async (id: number, c: Conn = db) =>
		(
			await c
				.select({
					plant: plants,
					cultivarName: cultivars.name,
					cultivarSlug: cultivars.slug,
					climateName: climateProfiles.name,
					climateSlug: climateProfiles.slug,
					gardenerName: users.name
				})
				.from(plants)
				.innerJoin(cultivars, eq(cultivars.id, plants.cultivarId))
				.leftJoin(climateProfiles, eq(climateProfiles.id, plants.climateProfileId))
				.leftJoin(users, eq(users.id, plants.gardenerId))
				.where(eq(plants.id, id))
		)[0],

	/** The mat a plant was divided from, and the plants divided from it. */
	family: async (plantId: number, parentId: number | null, c: Conn = db) => {
		const children = await c
			.select({ id: plants.id, plantedOn: plants.plantedOn, cultivarName: cultivars.name, archivedAt: plants.archivedAt })
			.from(plants)
			.innerJoin(cultivars, eq(cultivars.id, plants.cultivarId))
			.where(eq(plants.parentPlantId, plantId))
			.orderBy(asc(plants.plantedOn), asc(plants.id));
		const parents =
			parentId === null
				? []
				: await c
						.select({ id: parent.id, plantedOn: parent.plantedOn, cultivarName: parentCultivar.name, gardenerId: parent.gardenerId })
						.from(parent)
						.innerJoin(parentCultivar, eq(parentCultivar.id, parent.cultivarId))
						.where(eq(parent.id, parentId));
		return { parent: parents[0] ?? null, children };
	},

	steps: (plantId: number, c: Conn = db) => c.select().from(planSteps).where(eq(planSteps.plantId, plantId)).orderBy(asc(planSteps.likely), asc(planSteps.id)),

	milestones: (plantId: number, c: Conn = db) =>
		c.select().from(milestones).where(eq(milestones.plantId, plantId)).orderBy(asc(milestones.on), asc(milestones.id)),

	milestone: async (plantId: number, milestoneId: number, c: Conn = db) =>
		(await c.select().from(milestones).where(and(eq(milestones.plantId, plantId), eq(milestones.id, milestoneId))))[0],

	/** The milestone a photo belongs to, with its plant's gardener: who may see the photo. */
	milestoneOfPhoto: async (uploadId: number, c: Conn = db) =>
		(
			await c
				.select({ plantId: milestones.plantId, gardenerId: plants.gardenerId })
				.from(milestones)
				.innerJoin(plants, eq(plants.id, milestones.plantId))
				.where(eq(milestones.photoId, uploadId))
		)[0],

	insertMilestone: async (c: Conn, values: typeof milestones.$inferInsert) => (await c.insert(milestones).values(values).returning())[0]!,
	updateMilestone: async (c: Conn, id: number, values: Partial<typeof milestones.$inferInsert>) =>
		(await c.update(milestones).set({ ...values, updatedAt: new Date() }).where(eq(milestones.id, id)).returning())[0]!,
	deleteMilestone: (c: Conn, id: number) => c.delete(milestones).where(eq(milestones.id, id)),

	updatePlant: (c: Conn, id: number, values: Partial<typeof plants.$inferInsert>) => c.update(plants).set(values).where(eq(plants.id, id)),
	insertPlant: async (c: Conn, values: typeof plants.$inferInsert) => (await c.insert(plants).values(values).returning())[0]!
};
export type PlantRepository = typeof plantRepository;
