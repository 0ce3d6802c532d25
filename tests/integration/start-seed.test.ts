/**
 * `npm start` seeds the demo with plain Node through tsx, not through Vite, so a module the seed
 * reaches that only Vite can load (import.meta.glob, a .md or .svelte import) breaks a fresh
 * `npm start` while every Vite-run test still passes. This runs the seed exactly as `npm start`
 * does, on a scratch database of the tests' own cluster, twice (the seed is idempotent).
 */
import { spawnSync } from 'node:child_process';
import postgres from 'postgres';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cluster } from '../../scripts/pg.mjs';
import { migrateDatabase } from '../../scripts/migrate';
import { testPorts } from '../setup/ports';

const pg = cluster({ dir: '.data/test', port: testPorts.postgres, database: 'postgres', fast: true });
const dbName = `bunchline_start_seed_${process.pid}`;
const url = pg.url.replace(/\/postgres$/, `/${dbName}`);

beforeAll(async () => {
	pg.createDatabase(dbName);
	await migrateDatabase(url);
});
afterAll(() => pg.dropDatabase(dbName));

function seed() {
	return spawnSync(process.execPath, ['--import', 'tsx', 'scripts/seed.ts'], {
		env: { ...process.env, DATABASE_URL: url, BUNCHLINE_ENV: 'demo', ORIGIN: 'http://127.0.0.1:4173' },
		encoding: 'utf8',
		timeout: 120_000
	});
}

describe('the demo seed as npm start runs it (plain Node, tsx)', () => {
	it('seeds accounts, plants with stored plans and published guides; a second run changes nothing', async () => {
		const first = seed();
		expect(first.stderr).toBe('');
		expect(first.status).toBe(0);
		const sql = postgres(url, { max: 1, onnotice: () => {} });
		try {
			const counts = async () => (await sql<{ users: number; steps: number; guides: number }[]>`
				select (select count(*)::int from users) as users, (select count(*)::int from plan_steps) as steps,
				(select count(*)::int from guides where published_at is not null) as guides`)[0];
			const after = await counts();
			expect(after.users).toBeGreaterThan(0);
			expect(after.steps).toBeGreaterThan(0);
			expect(after.guides).toBeGreaterThan(0);
			expect(seed().status).toBe(0);
			expect(await counts()).toEqual(after);
		} finally {
			await sql.end();
		}
	}, 240_000);
});
