/**
 * Queries behind the nursery's table of plants. Every filter and sort reads a column kept on the
 * plant row (stage, next step, last milestone) so a page of a million plants is an index scan.
 */
import { and, asc, count, desc, eq, gte, inArray, isNotNull, isNull, lt, or, sql, type SQL } from 'drizzle-orm';
import type { PgColumn } from 'drizzle-orm/pg-core';
import { db } from '../db';
import { cultivars, marketDays, plants, sales, users } from '../db/schema';
import type { PlantSort, SortOrder } from '../../schema/plant-table';

/** The filters once resolved to ids and dates by the service. */
export interface PlantTableWhere {
	gardenerId?: number;
	/** Leave out archived plants (a gardener's own list does; the nursery's table shows them, marked). */
	activeOnly?: boolean;
	cultivarId?: number;
	stage?: string;
	marketDayId?: number;
	claimed?: boolean;
	/** Overdue: the next step's day is before this day. */
	overdueBefore?: string;
	/** Not overdue: no next step, or one on or after this day. */
	dueFrom?: string;
}

export interface PlantTableOrder {
	sort: PlantSort;
	order: SortOrder;
}

/** The day growth started (sale day less its age then): sorting by it sorts by age, with an index of its own. */
export const startedOn = sql`(${plants.soldOn} - ${plants.ageAtSaleWeeks} * 7)`;

function whereOf(w: PlantTableWhere): SQL | undefined {
	return and(
		w.gardenerId !== undefined ? eq(plants.gardenerId, w.gardenerId) : undefined,
		w.activeOnly ? isNull(plants.archivedAt) : undefined,
		w.cultivarId !== undefined ? eq(plants.cultivarId, w.cultivarId) : undefined,
		w.stage !== undefined ? eq(plants.stage, w.stage) : undefined,
		w.marketDayId !== undefined
			? inArray(plants.saleId, db.select({ id: sales.id }).from(sales).where(eq(sales.marketDayId, w.marketDayId)))
			: undefined,
		w.claimed === true ? isNotNull(plants.gardenerId) : w.claimed === false ? isNull(plants.gardenerId) : undefined,
		w.overdueBefore !== undefined ? lt(plants.nextStepOn, w.overdueBefore) : undefined,
		w.dueFrom !== undefined ? or(isNull(plants.nextStepOn), gte(plants.nextStepOn, w.dueFrom)) : undefined
	);
}

const SORT_COLUMN: Record<PlantSort, PgColumn | SQL> = {
	nextStep: plants.nextStepOn,
	soldOn: plants.soldOn,
	lastMilestone: plants.lastMilestoneOn,
	// Older first when ascending by age means an earlier start first.
	age: startedOn
};

/**
 * Column, then id, in one direction, so an index on (column, id) is read forwards or backwards.
 * PostgreSQL puts empty values last going up and first going down, which is what such a scan gives.
 */
function orderOf({ sort, order }: PlantTableOrder): SQL[] {
	const up = sort === 'age' ? order === 'desc' : order === 'asc';
	const dir = up ? asc : desc;
	return [dir(SORT_COLUMN[sort]), dir(plants.id)];
}

/** What a row of the table shows, joined after the page is cut, so joins never touch more than a page. */
const rowFields = {
	id: plants.id,
	cultivarSlug: cultivars.slug,
	cultivarName: cultivars.name,
	gardenerName: users.name,
	soldOn: plants.soldOn,
	ageAtSaleWeeks: plants.ageAtSaleWeeks,
	marketDayId: marketDays.id,
	marketDayOn: marketDays.on,
	marketPlace: marketDays.place,
	stage: plants.stage,
	nextStepOn: plants.nextStepOn,
	nextStepKind: plants.nextStepKind,
	lastMilestoneOn: plants.lastMilestoneOn,
	lastMilestoneKind: plants.lastMilestoneKind,
	archivedAt: plants.archivedAt
};

function rowsQuery(where: PlantTableWhere, order: PlantTableOrder) {
	return db
		.select(rowFields)
		.from(plants)
		.innerJoin(cultivars, eq(cultivars.id, plants.cultivarId))
		.leftJoin(users, eq(users.id, plants.gardenerId))
		.leftJoin(sales, eq(sales.id, plants.saleId))
		.leftJoin(marketDays, eq(marketDays.id, sales.marketDayId))
		.where(whereOf(where))
		.orderBy(...orderOf(order));
}

export type PlantTableRow = Awaited<ReturnType<typeof rowsQuery>>[number];
const FIELD_NAMES = Object.keys(rowFields) as (keyof typeof rowFields)[];

/** The queries as built, not run: the index test reads their plans with EXPLAIN. */
export const plantTableQueries = {
	page: (where: PlantTableWhere, order: PlantTableOrder, limit: number, offset: number) => rowsQuery(where, order).limit(limit).offset(offset),
	/** Counts, but stops at `cap`, so a broad filter never counts a million rows. */
	countUpTo: (where: PlantTableWhere, cap: number) =>
		db.select({ n: count() }).from(db.select({ one: sql`1` }).from(plants).where(whereOf(where)).limit(cap).as('matching'))
};

export const plantTableRepository = {
	page: async (where: PlantTableWhere, order: PlantTableOrder, limit: number, offset: number): Promise<PlantTableRow[]> =>
		plantTableQueries.page(where, order, limit, offset),

	async countUpTo(where: PlantTableWhere, cap: number): Promise<number> {
		const [row] = await plantTableQueries.countUpTo(where, cap);
		return row.n;
	},

	/** The planner's row estimate for the filter: instant at any size, and close for one or two filters. */
	async estimate(where: PlantTableWhere): Promise<number> {
		const query = db.select({ one: sql`1` }).from(plants).where(whereOf(where));
		const [row] = await db.execute<{ 'QUERY PLAN': [{ Plan: { 'Plan Rows': number } }] }>(sql`explain (format json) ${query}`);
		return Math.round(row['QUERY PLAN'][0].Plan['Plan Rows']);
	},

	/** Every matching row, read through a cursor in batches, so an export of any size holds one batch in memory. */
	async *stream(where: PlantTableWhere, order: PlantTableOrder, batch = 1000): AsyncGenerator<PlantTableRow[]> {
		const { sql: text, params } = rowsQuery(where, order).toSQL();
		const cursor = db.$client.unsafe(text, params as never[]).values().cursor(batch);
		for await (const rows of cursor) {
			yield rows.map((values) => Object.fromEntries(FIELD_NAMES.map((name, i) => [name, values[i]])) as PlantTableRow);
		}
	},

	cultivarIdBySlug: async (slug: string) => (await db.select({ id: cultivars.id }).from(cultivars).where(eq(cultivars.slug, slug)))[0]?.id,
	marketDayExists: async (id: number) => (await db.select({ id: marketDays.id }).from(marketDays).where(eq(marketDays.id, id))).length > 0,

	/** What the filters offer: every cultivar (retired ones still have plants) and the market days with sales, latest first. */
	filterChoices: async () => {
		const [cultivarRows, marketRows] = await Promise.all([
			db.select({ slug: cultivars.slug, name: cultivars.name }).from(cultivars).orderBy(asc(cultivars.name)),
			db.select({ id: marketDays.id, on: marketDays.on, place: marketDays.place }).from(marketDays).orderBy(desc(marketDays.on), asc(marketDays.place))
		]);
		return { cultivars: cultivarRows, marketDays: marketRows };
	}
};

export type PlantTableRepository = typeof plantTableRepository;
