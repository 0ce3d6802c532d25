/** Sales and the plants they create. Queries only; the rules are in service.ts. */
import { and, asc, desc, eq, inArray, isNull, isNotNull, sql } from 'drizzle-orm';
import { cultivars, marketDays, plants, sales } from '../db/schema';
import type { AnyDb } from '../secrets';

const saleColumns = {
	id: sales.id,
	clientId: sales.clientId,
	batchId: sales.batchId,
	cultivarId: sales.cultivarId,
	cultivarSlug: cultivars.slug,
	cultivarName: cultivars.name,
	marketDayId: sales.marketDayId,
	place: marketDays.place,
	soldOn: sales.soldOn,
	quantity: sales.quantity,
	pricePerPlantCents: sales.pricePerPlantCents,
	buyerEmail: sales.buyerEmail,
	soldBy: sales.soldBy,
	undoneAt: sales.undoneAt,
	createdAt: sales.createdAt
};

const withNames = (db: AnyDb) =>
	db.select(saleColumns).from(sales).innerJoin(cultivars, eq(cultivars.id, sales.cultivarId)).leftJoin(marketDays, eq(marketDays.id, sales.marketDayId));

export type SaleRow = NonNullable<Awaited<ReturnType<ReturnType<typeof salesRepository>['sale']>>>;

export function salesRepository(db: AnyDb) {
	return {
		/** Inserts unless a sale with this client id exists; undefined when it did. */
		insertSale: async (v: typeof sales.$inferInsert) =>
			(await db.insert(sales).values(v).onConflictDoNothing({ target: sales.clientId }).returning({ id: sales.id }))[0],
		sale: async (id: number) => (await withNames(db).where(eq(sales.id, id)))[0],
		saleByClientId: async (clientId: string) => (await withNames(db).where(eq(sales.clientId, clientId)))[0],
		/** The day's sales that still stand, newest first. */
		salesOn: (on: string) => withNames(db).where(and(eq(sales.soldOn, on), isNull(sales.undoneAt))).orderBy(desc(sales.createdAt), desc(sales.id)),
		insertPlants: (rows: (typeof plants.$inferInsert)[]) => db.insert(plants).values(rows).returning({ id: plants.id, claimVersion: plants.claimVersion }),
		setClaimHash: (plantId: number, claimCodeHash: string, claimVersion: number) =>
			db.update(plants).set({ claimCodeHash, claimVersion }).where(eq(plants.id, plantId)),
		plantsOfSale: (saleId: number) =>
			db
				.select({ id: plants.id, claimVersion: plants.claimVersion, claimedAt: plants.claimedAt, ageAtSaleWeeks: plants.ageAtSaleWeeks })
				.from(plants)
				.where(eq(plants.saleId, saleId))
				.orderBy(asc(plants.id)),
		/** Marks the sale undone if it still stands and was recorded after `since`; undefined otherwise. */
		markUndone: async (id: number, now: Date, since: Date) =>
			(
				await db
					.update(sales)
					.set({ undoneAt: now })
					.where(and(eq(sales.id, id), isNull(sales.undoneAt), sql`${sales.createdAt} >= ${since.toISOString()}`))
					.returning({ id: sales.id })
			)[0],
		claimedCount: async (saleId: number) =>
			(await db.select({ id: plants.id }).from(plants).where(and(eq(plants.saleId, saleId), isNotNull(plants.claimedAt)))).length,
		deletePlantsOfSale: (saleId: number) => db.delete(plants).where(eq(plants.saleId, saleId)),
		setBuyerEmail: (saleId: number, buyerEmail: string) => db.update(sales).set({ buyerEmail }).where(eq(sales.id, saleId)),
		/** Bumps the claim version of unclaimed plants (their old codes stop working); returns them. */
		bumpClaimVersions: (plantIds: number[]) =>
			db
				.update(plants)
				.set({ claimVersion: sql`${plants.claimVersion} + 1` })
				.where(and(inArray(plants.id, plantIds), isNull(plants.claimedAt)))
				.returning({ id: plants.id, claimVersion: plants.claimVersion })
	};
}
