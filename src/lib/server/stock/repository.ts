/** Stock queries: batches, market days and the movements that change a batch's count. Queries only. */
import { and, asc, count, desc, eq, gt, gte, inArray, isNull, or, sql } from 'drizzle-orm';
import { cultivars, marketDays, stockBatches, stockMovements } from '../db/schema';
import type { AnyDb } from '../secrets';
import type { MovementKind } from '../../schema/stock';

const batchColumns = {
	id: stockBatches.id,
	cultivarId: stockBatches.cultivarId,
	cultivarSlug: cultivars.slug,
	cultivarName: cultivars.name,
	usualPriceCents: cultivars.usualPriceCents,
	pottedOn: stockBatches.pottedOn,
	onHand: stockBatches.onHand,
	marketDayId: stockBatches.marketDayId,
	marketDayOn: marketDays.on,
	marketDayPlace: marketDays.place
};

export type BatchRow = {
	id: number;
	cultivarId: number;
	cultivarSlug: string;
	cultivarName: string;
	usualPriceCents: number | null;
	pottedOn: string;
	onHand: number;
	marketDayId: number | null;
	marketDayOn: string | null;
	marketDayPlace: string | null;
};

const withNames = (db: AnyDb) =>
	db.select(batchColumns).from(stockBatches).innerJoin(cultivars, eq(cultivars.id, stockBatches.cultivarId)).leftJoin(marketDays, eq(marketDays.id, stockBatches.marketDayId));

export function stockRepository(db: AnyDb) {
	return {
		/** Batches with plants on hand, a page at a time, by cultivar then age. */
		onHandPage: (limit: number, offset: number): Promise<BatchRow[]> =>
			withNames(db).where(gt(stockBatches.onHand, 0)).orderBy(asc(cultivars.name), asc(stockBatches.pottedOn), asc(stockBatches.id)).limit(limit).offset(offset),
		countOnHand: async () => (await db.select({ n: count() }).from(stockBatches).where(gt(stockBatches.onHand, 0)))[0].n,
		/** What the stall can sell from: on hand at the nursery or loaded for one of the given market days. */
		sellable: (marketDayIds: number[]): Promise<BatchRow[]> =>
			withNames(db)
				.where(and(gt(stockBatches.onHand, 0), isNull(cultivars.retiredAt), marketDayIds.length ? or(isNull(stockBatches.marketDayId), inArray(stockBatches.marketDayId, marketDayIds)) : isNull(stockBatches.marketDayId)))
				.orderBy(asc(cultivars.name), asc(stockBatches.pottedOn)),
		batch: async (id: number): Promise<BatchRow | undefined> => (await withNames(db).where(eq(stockBatches.id, id)))[0],
		/** Every batch loaded for a market day, sold out or not: the end-of-day view. */
		loadedFor: (marketDayId: number): Promise<BatchRow[]> =>
			withNames(db).where(eq(stockBatches.marketDayId, marketDayId)).orderBy(asc(cultivars.name), asc(stockBatches.pottedOn)),
		/** Sum of movements of each kind per batch, for "loaded, sold, left". */
		movementTotals: (batchIds: number[]) =>
			batchIds.length === 0
				? Promise.resolve([])
				: db
						.select({ batchId: stockMovements.batchId, kind: stockMovements.kind, total: sql<number>`sum(${stockMovements.change})::int` })
						.from(stockMovements)
						.where(inArray(stockMovements.batchId, batchIds))
						.groupBy(stockMovements.batchId, stockMovements.kind),
		insertBatch: async (v: { cultivarId: number; pottedOn: string; onHand: number; marketDayId: number | null }) =>
			(await db.insert(stockBatches).values(v).returning())[0],
		/** Same cultivar, potting day and place: moved plants join it instead of making a new batch. */
		findTwin: async (v: { cultivarId: number; pottedOn: string; marketDayId: number | null }) =>
			(
				await db
					.select()
					.from(stockBatches)
					.where(and(eq(stockBatches.cultivarId, v.cultivarId), eq(stockBatches.pottedOn, v.pottedOn), v.marketDayId === null ? isNull(stockBatches.marketDayId) : eq(stockBatches.marketDayId, v.marketDayId)))
					.orderBy(asc(stockBatches.id))
					.limit(1)
					.for('update')
			)[0],
		/**
		 * Changes a batch's count only if it stays at or above zero, in one statement: two sellers of
		 * the last plant cannot both succeed. Returns the batch after the change, or undefined.
		 */
		changeCount: async (id: number, change: number) =>
			(
				await db
					.update(stockBatches)
					.set({ onHand: sql`${stockBatches.onHand} + ${change}` })
					.where(and(eq(stockBatches.id, id), gte(sql`${stockBatches.onHand} + ${change}`, 0)))
					.returning()
			)[0],
		exists: async (id: number) => (await db.select({ id: stockBatches.id }).from(stockBatches).where(eq(stockBatches.id, id))).length > 0,
		recordMovement: (v: { batchId: number; change: number; kind: MovementKind; reason?: string; userId: number | null }) => db.insert(stockMovements).values(v),
		cultivarBySlug: async (slug: string) => (await db.select().from(cultivars).where(eq(cultivars.slug, slug)))[0],
		marketDay: async (id: number) => (await db.select().from(marketDays).where(eq(marketDays.id, id)))[0],
		marketDaysOn: (on: string) => db.select().from(marketDays).where(eq(marketDays.on, on)).orderBy(asc(marketDays.place)),
		/** Market days from a date on (upcoming), and the most recent ones before it. */
		marketDaysFrom: (on: string, limit: number) => db.select().from(marketDays).where(gte(marketDays.on, on)).orderBy(asc(marketDays.on)).limit(limit),
		marketDaysBefore: (on: string, limit: number) => db.select().from(marketDays).where(sql`${marketDays.on} < ${on}`).orderBy(desc(marketDays.on)).limit(limit),
		insertMarketDay: async (v: { on: string; place: string }) =>
			(await db.insert(marketDays).values(v).onConflictDoNothing({ target: [marketDays.on, marketDays.place] }).returning())[0],
		/** Cultivars (not retired) with how many plants of each are on hand anywhere. */
		cultivarsWithStock: () =>
			db
				.select({
					id: cultivars.id,
					slug: cultivars.slug,
					name: cultivars.name,
					group: cultivars.group,
					subgroup: cultivars.subgroup,
					size: cultivars.size,
					usualPriceCents: cultivars.usualPriceCents,
					onHand: sql<number>`coalesce(sum(${stockBatches.onHand}), 0)::int`
				})
				.from(cultivars)
				.leftJoin(stockBatches, eq(stockBatches.cultivarId, cultivars.id))
				.where(isNull(cultivars.retiredAt))
				.groupBy(cultivars.id)
				.orderBy(asc(cultivars.name))
	};
}

export type StockRepository = ReturnType<typeof stockRepository>;
