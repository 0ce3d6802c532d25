/** Plant queries for the lists, the API and claiming. Queries only. */
import { and, asc, count, desc, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import { climateProfiles, cultivars, milestones, planSteps, plants, sales, users } from '../db/schema';
import type { AnyDb } from '../secrets';

const listColumns = {
	id: plants.id,
	saleId: plants.saleId,
	cultivarId: plants.cultivarId,
	cultivarSlug: cultivars.slug,
	cultivarName: cultivars.name,
	soldOn: plants.soldOn,
	ageAtSaleWeeks: plants.ageAtSaleWeeks,
	claimedAt: plants.claimedAt,
	gardenerId: plants.gardenerId,
	gardenerName: users.name,
	plantedOn: plants.plantedOn,
	ageAtPlantingWeeks: plants.ageAtPlantingWeeks,
	climateProfileId: plants.climateProfileId,
	climateName: climateProfiles.name,
	profileMeans: climateProfiles.monthlyMeanC,
	customMonthlyMeanC: plants.customMonthlyMeanC,
	units: plants.units
};

const listQuery = (db: AnyDb) =>
	db
		.select(listColumns)
		.from(plants)
		.innerJoin(cultivars, eq(cultivars.id, plants.cultivarId))
		.leftJoin(users, eq(users.id, plants.gardenerId))
		.leftJoin(climateProfiles, eq(climateProfiles.id, plants.climateProfileId));

export type PlantListRow = Awaited<ReturnType<typeof listQuery>>[number];

/** Who is asking: a gardener sees their own plants, staff and the owner see every plant. */
export type PlantScope = { kind: 'gardener'; gardenerId: number } | { kind: 'all' };

/**
 * The filter for a scope. Further filters (stage, cultivar, dates) join this list, so one query
 * serves the gardener's page, the nursery's table and the API.
 */
export function plantFilters(scope: PlantScope): SQL[] {
	const where: SQL[] = [isNull(plants.archivedAt)];
	if (scope.kind === 'gardener') where.push(eq(plants.gardenerId, scope.gardenerId));
	return where;
}

export function plantsRepository(db: AnyDb) {
	const base = () => listQuery(db);
	return {
		page: (where: SQL[], limit: number, offset: number) =>
			base()
				.where(and(...where))
				.orderBy(sql`${plants.plantedOn} desc nulls last`, desc(plants.soldOn), asc(plants.id))
				.limit(limit)
				.offset(offset),
		count: async (where: SQL[]) => (await db.select({ n: count() }).from(plants).where(and(...where)))[0].n,
		one: async (where: SQL[]) => (await base().where(and(...where)))[0],
		/** The stored plan steps of a page of plants, each plant's in plan order. */
		storedSteps: (plantIds: number[]) =>
			plantIds.length === 0
				? Promise.resolve([])
				: db
						.select({ plantId: planSteps.plantId, kind: planSteps.kind, title: planSteps.title, generation: planSteps.generation, likely: planSteps.likely, observed: planSteps.observed })
						.from(planSteps)
						.where(inArray(planSteps.plantId, plantIds))
						.orderBy(asc(planSteps.plantId), asc(planSteps.likely), asc(planSteps.id)),
		/** The logged milestones of a page of plants. */
		/** The milestones of these plants, newest first (the board shows each plant's latest few). */
		milestonesOf: (plantIds: number[]) =>
			plantIds.length === 0
				? Promise.resolve([])
				: db
						.select({ plantId: milestones.plantId, id: milestones.id, kind: milestones.kind, generation: milestones.generation, on: milestones.on, leaves: milestones.leaves, photoId: milestones.photoId })
						.from(milestones)
						.where(inArray(milestones.plantId, plantIds))
						.orderBy(desc(milestones.on), desc(milestones.id)),
		/** A plant by its claim code's hash, with what the claim page shows. */
		byClaimHash: async (hash: string) =>
			(
				await db
					.select({
						id: plants.id,
						cultivarId: plants.cultivarId,
						cultivarName: cultivars.name,
						soldOn: plants.soldOn,
						ageAtSaleWeeks: plants.ageAtSaleWeeks,
						claimedAt: plants.claimedAt,
						gardenerId: plants.gardenerId,
						buyerEmail: sales.buyerEmail
					})
					.from(plants)
					.innerJoin(cultivars, eq(cultivars.id, plants.cultivarId))
					.leftJoin(sales, eq(sales.id, plants.saleId))
					.where(eq(plants.claimCodeHash, hash))
			)[0],
		/** Claims the plant only if its code is still open: a code is used once, even by racing requests. */
		claim: async (hash: string, v: Partial<typeof plants.$inferInsert>) =>
			(
				await db
					.update(plants)
					.set(v)
					.where(and(eq(plants.claimCodeHash, hash), isNull(plants.claimedAt)))
					.returning({ id: plants.id })
			)[0]
	};
}
