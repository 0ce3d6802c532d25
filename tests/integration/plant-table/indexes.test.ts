// The nursery table's queries on 50,000 plants, after VACUUM ANALYZE: PostgreSQL plans them as index
// scans, never a sequential scan of plants. Asserts the plans' shape, not their speed (speed is
// measured on a million plants in bench/table.ts, figures in bench/RESULTS.md).
import postgres from 'postgres';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { migrateDatabase } from '../../../scripts/migrate';
import { fillScaleData } from '../../../scripts/scale-data';
import { plantTableQuerySchema } from '../../../src/lib/schema/plant-table';
import { plantTableQueries, type PlantTableWhere } from '../../../src/lib/server/plant-table/repository';

const PLANTS = 50_000;
const name = `bunchline_index_${process.pid}_${Date.now().toString(36)}`;
const baseUrl = process.env.DATABASE_URL!;
const url = baseUrl.replace(/\/[^/]+$/, `/${name}`);
let admin: postgres.Sql;
let sql: postgres.Sql;
let grandNain: number;

interface PlanNode {
	'Node Type': string;
	'Relation Name'?: string;
	'Index Name'?: string;
	Plans?: PlanNode[];
}
const walk = (n: PlanNode): PlanNode[] => [n, ...(n.Plans ?? []).flatMap(walk)];

async function planOf(query: { toSQL(): { sql: string; params: unknown[] } }): Promise<PlanNode[]> {
	const { sql: text, params } = query.toSQL();
	const [row] = await sql.unsafe(`explain (format json) ${text}`, params as never[]);
	return walk((row['QUERY PLAN'] as [{ Plan: PlanNode }])[0].Plan);
}

/** How plants is read: the index used, and never a sequential scan. */
function plantsAccess(nodes: PlanNode[]) {
	const onPlants = nodes.filter((n) => n['Relation Name'] === 'plants' || n['Index Name']?.startsWith('plants_'));
	return { types: onPlants.map((n) => n['Node Type']), indexes: onPlants.map((n) => n['Index Name']).filter(Boolean) };
}

beforeAll(async () => {
	admin = postgres(baseUrl, { max: 1, onnotice: () => {} });
	await admin.unsafe(`create database ${name}`);
	await migrateDatabase(url);
	sql = postgres(url, { max: 1, onnotice: () => {} });
	await fillScaleData(sql, PLANTS, { today: '2026-06-01', steps: false });
	// What autovacuum does on a live database: statistics, and the visibility map index-only scans rely on.
	await sql`vacuum analyze`;
	[{ id: grandNain }] = await sql`select id from cultivars where slug = 'grand-nain'`;
}, 300_000);

afterAll(async () => {
	await sql?.end();
	await admin?.unsafe(`drop database if exists ${name} with (force)`);
	await admin?.end();
});

const query = (params: Record<string, string>) => plantTableQuerySchema.parse(params);
const page = (where: PlantTableWhere, params: Record<string, string>) => {
	const q = query(params);
	return plantTableQueries.page(where, q, q.perPage, (q.page - 1) * q.perPage);
};

describe(`the table's plans on ${PLANTS.toLocaleString('en')} plants`, () => {
	it('has the plants', async () => {
		const [{ n }] = await sql`select count(*)::int as n from plants`;
		expect(n).toBe(PLANTS);
	});

	const cases: [string, () => PlanNode[] | Promise<PlanNode[]>, string][] = [
		['first page: next step, earliest first', () => planOf(page({}, {})), 'plants_next_step_idx'],
		['filtered page: cultivar and stage', () => planOf(page({ cultivarId: grandNain, stage: 'growing-leaves' }, { cultivar: 'grand-nain', stage: 'growing-leaves' })), 'plants_cultivar_stage_idx'],
		['sorted page: oldest first', () => planOf(page({}, { sort: 'age', order: 'desc' })), 'plants_started_idx'],
		['sorted page: latest sale first', () => planOf(page({}, { sort: 'soldOn', order: 'desc' })), 'plants_sold_on_idx'],
		['sorted page: last milestone', () => planOf(page({}, { sort: 'lastMilestone' })), 'plants_last_milestone_idx'],
		['count of a cultivar and stage', () => planOf(plantTableQueries.countUpTo({ cultivarId: grandNain, stage: 'growing-leaves' }, 10_001)), 'plants_cultivar_stage_idx']
	];
	for (const [label, plan, index] of cases) {
		it(`${label}: reads plants through ${index}, no sequential scan`, async () => {
			const access = plantsAccess(await plan());
			expect(access.types).not.toContain('Seq Scan');
			expect(access.indexes).toContain(index);
		});
	}

});
