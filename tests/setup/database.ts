// Starts a PostgreSQL cluster of the tests' own (never the demo one), creates a fresh
// database for this run, migrates it, and drops it afterwards.
import { rmSync } from 'node:fs';
import { cluster } from '../../scripts/pg.mjs';
import { migrateDatabase } from '../../scripts/migrate';
import { testPorts } from './ports';

export default async function setup() {
	const pg = cluster({ dir: '.data/test', port: testPorts.postgres, database: 'postgres', fast: true });
	pg.start();
	const name = `bunchline_test_${process.pid}_${Date.now().toString(36)}`;
	const uploadDir = `.data/test/uploads-${name}`;
	const teardown = async () => {
		rmSync(uploadDir, { recursive: true, force: true });
		pg.dropDatabase(name);
		if (pg.startedHere) pg.stop();
	};
	try {
		pg.createDatabase(name);
		const url = pg.url.replace(/\/postgres$/, `/${name}`);
		await migrateDatabase(url);
		process.env.DATABASE_URL = url;
		process.env.BUNCHLINE_ENV = 'test';
		// Photos of this run go to a folder of its own, removed with the database.
		process.env.UPLOAD_DIR = uploadDir;
	} catch (e) {
		// vitest skips the teardown of a setup that failed: leave nothing running.
		await teardown();
		throw e;
	}
	return teardown;
}
