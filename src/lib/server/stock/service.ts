/**
 * Stock rules: receive a batch, adjust its count with a reason, move plants to a market day and
 * back, and read what is on hand. Every change of a count is one conditional update plus one
 * movement row, in one transaction; a count never goes below zero.
 */
import { parseIsoDate } from '../../care';
import { AGE_MAX_WEEKS } from '../../schema/plan';
import type { ReceiveInput } from '../../schema/stock';
import type { StallBatch } from '../../stall/search';
import { UserFacingError } from '../errors';
import type { AnyDb } from '../secrets';
import { stockRepository, type BatchRow } from './repository';

export type { BatchRow };

/** Whole weeks from potting on to a day: the plant's age at a sale. */
export function ageInWeeks(pottedOn: string, on: string): number {
	return Math.floor((parseIsoDate(on) - parseIsoDate(pottedOn)) / 7);
}

export interface StockDeps {
	db: AnyDb;
	/** Told when a cultivar gets stock, so the waitlist hears of it (after the commit). */
	onStockArrived?: (cultivarId: number) => Promise<void>;
}

/** A batch as pages and the API show it (the stall's type-ahead reads the same shape). */
export type BatchView = StallBatch;

export function batchView(b: BatchRow, today: string): BatchView {
	return {
		id: b.id,
		cultivar: { slug: b.cultivarSlug, name: b.cultivarName },
		pottedOn: b.pottedOn,
		ageWeeks: Math.max(0, ageInWeeks(b.pottedOn, today)),
		onHand: b.onHand,
		location: b.marketDayId === null ? null : { marketDayId: b.marketDayId, on: b.marketDayOn!, place: b.marketDayPlace! },
		usualPriceCents: b.usualPriceCents
	};
}

export function createStockService({ db, onStockArrived }: StockDeps) {
	const repo = stockRepository(db);

	async function marketDayOrRefuse(r: ReturnType<typeof stockRepository>, id: number, field: string) {
		const day = await r.marketDay(id);
		if (!day) throw new UserFacingError(field, 'No such market day: choose one from the list');
		return day;
	}

	return {
		async page(limit: number, offset: number, today: string) {
			const [rows, total] = await Promise.all([repo.onHandPage(limit, offset), repo.countOnHand()]);
			return { batches: rows.map((b) => batchView(b, today)), total };
		},

		async receive(input: ReceiveInput, userId: number, today: string): Promise<BatchView> {
			if (input.pottedOn > today) throw new UserFacingError('pottedOn', 'A batch cannot be potted on after today');
			if (ageInWeeks(input.pottedOn, today) > AGE_MAX_WEEKS) {
				throw new UserFacingError('pottedOn', `Plans cover plants up to ${AGE_MAX_WEEKS} weeks old: give a potting date within two years`);
			}
			const batch = await db.transaction(async (tx) => {
				const r = stockRepository(tx);
				const cultivar = await r.cultivarBySlug(input.cultivar);
				if (!cultivar) throw new UserFacingError('cultivar', 'Unknown cultivar: choose one from the catalogue');
				if (cultivar.retiredAt) throw new UserFacingError('cultivar', 'This cultivar is retired from sale');
				if (input.location !== undefined) await marketDayOrRefuse(r, input.location, 'location');
				const row = await r.insertBatch({ cultivarId: cultivar.id, pottedOn: input.pottedOn, onHand: input.count, marketDayId: input.location ?? null });
				await r.recordMovement({ batchId: row.id, change: input.count, kind: 'received', userId });
				return (await r.batch(row.id))!;
			});
			await onStockArrived?.(batch.cultivarId);
			return batchView(batch, today);
		},

		async adjust(input: { batchId: number; change: number; reason: string }, userId: number, today: string): Promise<BatchView> {
			const batch = await db.transaction(async (tx) => {
				const r = stockRepository(tx);
				const changed = await r.changeCount(input.batchId, input.change);
				if (!changed) {
					if (!(await r.exists(input.batchId))) throw new UserFacingError('batchId', 'No such batch', 404);
					throw new UserFacingError('change', 'That would take the count below zero', 409);
				}
				await r.recordMovement({ batchId: input.batchId, change: input.change, kind: 'adjusted', reason: input.reason, userId });
				return (await r.batch(input.batchId))!;
			});
			if (input.change > 0) await onStockArrived?.(batch.cultivarId);
			return batchView(batch, today);
		},

		/** Moves some plants of a batch to a market day (or back to the nursery, `to` null). */
		async move(input: { batchId: number; count: number; to: number | null }, userId: number) {
			await db.transaction(async (tx) => {
				const r = stockRepository(tx);
				const from = await r.batch(input.batchId);
				if (!from) throw new UserFacingError('batchId', 'No such batch', 404);
				if (input.to !== null) await marketDayOrRefuse(r, input.to, 'to');
				if (from.marketDayId === input.to) throw new UserFacingError('to', 'The plants are already there');
				if (!(await r.changeCount(from.id, -input.count))) throw new UserFacingError('count', `Only ${from.onHand} on hand in this batch`, 409);
				const place = { cultivarId: from.cultivarId, pottedOn: from.pottedOn, marketDayId: input.to };
				const twin = (await r.findTwin(place)) ?? (await r.insertBatch({ ...place, onHand: 0 }));
				await r.changeCount(twin.id, input.count);
				await r.recordMovement({ batchId: from.id, change: -input.count, kind: 'moved-out', userId });
				await r.recordMovement({ batchId: twin.id, change: input.count, kind: 'moved-in', userId });
			});
		},

		async addMarketDay(input: { on: string; place: string }) {
			const day = await repo.insertMarketDay(input);
			if (!day) throw new UserFacingError('on', 'That market day is already listed', 409);
			return day;
		},

		/** Market days around today: today and the next ones, then the last few before. */
		async marketDays(today: string) {
			const [upcoming, past] = await Promise.all([repo.marketDaysFrom(today, 8), repo.marketDaysBefore(today, 4)]);
			return { upcoming, past };
		},

		/** The end of a market day: per batch loaded, how many came, were sold and are left. */
		async dayReport(marketDayId: number, today: string) {
			const day = await marketDayOrRefuse(repo, marketDayId, 'day');
			const batches = await repo.loadedFor(marketDayId);
			const totals = await repo.movementTotals(batches.map((b) => b.id));
			const sum = (batchId: number, kinds: string[]) => totals.filter((t) => t.batchId === batchId && kinds.includes(t.kind)).reduce((a, t) => a + t.total, 0);
			return {
				day,
				rows: batches.map((b) => ({
					...batchView(b, today),
					loaded: sum(b.id, ['received', 'moved-in']),
					sold: -sum(b.id, ['sold', 'undone']),
					returned: -sum(b.id, ['moved-out']),
					adjusted: sum(b.id, ['adjusted'])
				}))
			};
		},

		/** What the stall sells from today: batches loaded for today's market days first, then the nursery's. */
		async sellableToday(today: string) {
			const days = await repo.marketDaysOn(today);
			const rows = (await repo.sellable(days.map((d) => d.id))).map((b) => batchView(b, today));
			rows.sort((a, b) => Number(a.location === null) - Number(b.location === null));
			return { days, batches: rows };
		},

		cultivarsWithStock: () => repo.cultivarsWithStock()
	};
}

export type StockService = ReturnType<typeof createStockService>;
