// npm run bench:table: the nursery table's queries against the scratch database that
// `npm run seed:scale -- N` filled. Times the service call behind GET /api/v1/plants (page query,
// capped count, estimate when the cap is passed) and prints each query's plan (EXPLAIN ANALYZE).
import os from 'node:os';
import postgres from 'postgres';
import { scaleCluster } from '../scripts/seed-scale';

const RUNS = 25;
const WARM_UP = 3;

const pg = scaleCluster();
pg.start();
process.env.DATABASE_URL = pg.url;
process.env.BUNCHLINE_ENV ??= 'test';

try {
	const { makePlantTableService } = await import('../src/lib/server/plant-table/service');
	const { plantTableQueries, plantTableRepository } = await import('../src/lib/server/plant-table/repository');
	// Today from the clock: the app reads the nursery's time zone from its cached catalogue snapshot, not timed here.
	const plantTableService = makePlantTableService({ repository: plantTableRepository, today: async () => new Date().toISOString().slice(0, 10) });
	const { plantTableQuerySchema } = await import('../src/lib/schema/plant-table');
	const { db } = await import('../src/lib/server/db');
	const { sql } = await import('drizzle-orm');
	const raw = postgres(pg.url, { max: 1, onnotice: () => {} });
	const [{ plants, steps }] = await raw`select (select count(*) from plants)::int as plants, (select count(*) from plan_steps)::int as steps`;
	const [grandNain] = await raw`select id, slug from cultivars where slug = 'grand-nain'`;
	const staff = { id: 0, role: 'staff' as const };

	const cases: [string, Record<string, string>, object][] = [
		['first page (next step, earliest first)', {}, {}],
		['filtered page (cultivar grand-nain, stage feeding)', { cultivar: 'grand-nain', stage: 'feeding' }, { cultivarId: grandNain.id, stage: 'feeding' }],
		['sorted page (age, oldest first)', { sort: 'age', order: 'desc' }, {}],
		['sorted page 40 (sale day, latest first)', { sort: 'soldOn', order: 'desc', page: '40' }, {}],
		['overdue, claimed (next step before today)', { overdue: 'yes', claimed: 'yes' }, { overdueBefore: new Date().toISOString().slice(0, 10), claimed: true }]
	];

	console.log(`node ${process.version}, ${os.cpus()[0].model}, ${os.cpus().length} cores, load ${os.loadavg().map((l) => l.toFixed(1)).join(' ')}`);
	console.log(`${plants.toLocaleString('en')} plants, ${steps.toLocaleString('en')} plan steps; ${RUNS} runs per case after ${WARM_UP} warm-up\n`);
	console.log('| case | median | p90 | max | total answered |');
	console.log('| --- | ---: | ---: | ---: | --- |');
	const plans: string[] = [];
	for (const [label, params, where] of cases) {
		const query = plantTableQuerySchema.parse(params);
		const times: number[] = [];
		let answer = { total: 0, totalExact: true, plants: [] as unknown[] };
		for (let i = 0; i < WARM_UP + RUNS; i++) {
			const t0 = performance.now();
			answer = await plantTableService.list(query, staff);
			if (i >= WARM_UP) times.push(performance.now() - t0);
		}
		times.sort((a, b) => a - b);
		const at = (q: number) => times[Math.min(times.length - 1, Math.floor(q * times.length))].toFixed(1);
		console.log(`| ${label} | ${at(0.5)} ms | ${at(0.9)} ms | ${at(1)} ms | ${answer.totalExact ? '' : 'about '}${answer.total.toLocaleString('en')} (${answer.plants.length} rows) |`);
		for (const [name, q] of [
			['page', plantTableQueries.page(where, query, query.perPage, (query.page - 1) * query.perPage)],
			['count', plantTableQueries.countUpTo(where, 10_001)]
		] as const) {
			const rows = await db.execute<{ 'QUERY PLAN': string }>(sql`explain (analyze, buffers, costs off) ${q}`);
			plans.push(`-- ${label}: ${name}\n${[...rows].map((r) => r['QUERY PLAN']).join('\n')}`);
		}
	}
	console.log('\n' + plans.join('\n\n'));
	await raw.end();
	await db.$client.end();
} finally {
	if (pg.startedHere) pg.stop();
}
