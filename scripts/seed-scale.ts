// npm run seed:scale -- N: a scratch database (its own cluster under .data/scale, never the demo
// or test database) filled with N plants, their sales, gardeners and stored plan steps, for
// measuring the nursery's table at scale (npm run bench:table). Stops the cluster it started.
import { createHash } from 'node:crypto';
import postgres from 'postgres';
import { cluster } from './pg.mjs';
import { migrateDatabase } from './migrate';
import { fillScaleData } from './scale-data';
import { isMainModule } from './main-module.mjs';

export const SCALE_DATABASE = 'bunchline_scale';

/** The scratch cluster, on a port derived from the checkout path like the test cluster's. */
export function scaleCluster() {
	const offset = parseInt(createHash('sha1').update(process.cwd()).digest('hex').slice(0, 6), 16) % 400;
	return cluster({ dir: '.data/scale', port: Number(process.env.BUNCHLINE_SCALE_PG_PORT ?? 58500 + offset), database: SCALE_DATABASE, fast: true });
}

/** Superuser connection to the scratch database: bulk loading skips foreign-key triggers, which only a superuser may. */
export const scaleAdminUrl = (pg: ReturnType<typeof scaleCluster>) => pg.adminUrl.replace(/\/postgres$/, `/${SCALE_DATABASE}`);

/** Secondary indexes of the bulk-loaded tables: dropped before COPY and built once after, which is much faster. */
const BULK_TABLES = ['users', 'sales', 'plants', 'plan_steps'];

async function seedScale(n: number) {
	const pg = scaleCluster();
	const started = Date.now();
	const log = (m: string) => console.log(`[${((Date.now() - started) / 1000).toFixed(1)} s] ${m}`);
	pg.start();
	try {
		pg.dropDatabase(SCALE_DATABASE);
		pg.createDatabase(SCALE_DATABASE);
		await migrateDatabase(pg.url);
		log('migrated');
		const sql = postgres(scaleAdminUrl(pg), { max: 1, onnotice: () => {} });
		try {
			await sql`set session_replication_role = replica`;
			await sql`set synchronous_commit = off`;
			await sql`set maintenance_work_mem = '512MB'`;
			const indexes = await sql<{ name: string; def: string }[]>`
				select i.indexname as name, i.indexdef as def from pg_indexes i
				where i.schemaname = 'public' and i.tablename in ${sql(BULK_TABLES)}
				and not exists (select 1 from pg_constraint c where c.conname = i.indexname)`;
			for (const ix of indexes) await sql.unsafe(`drop index "${ix.name}"`);
			const today = new Date().toISOString().slice(0, 10);
			const { steps } = await fillScaleData(sql, n, { today, log });
			log(`loaded ${n.toLocaleString('en')} plants and ${steps.toLocaleString('en')} plan steps; building ${indexes.length} indexes…`);
			for (const ix of indexes) {
				await sql.unsafe(ix.def);
				log(`  ${ix.name}`);
			}
			await sql`vacuum analyze`;
			log('vacuumed and analysed');
			const [size] = await sql`select pg_size_pretty(pg_database_size(current_database())) as size`;
			log(`done: database ${SCALE_DATABASE} is ${size.size}`);
		} finally {
			await sql.end();
		}
	} finally {
		if (pg.startedHere) pg.stop();
	}
}

if (isMainModule(import.meta.url)) {
	const n = Number(process.argv[2]);
	if (!Number.isInteger(n) || n < 1 || n > 10_000_000) {
		console.error('usage: npm run seed:scale -- N   (N plants, 1 to 10,000,000)');
		process.exit(2);
	}
	await seedScale(n);
}
