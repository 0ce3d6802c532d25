// Applies the committed SQL migrations in drizzle/ with drizzle-orm's migrator, then writes the
// engine's built-in cultivars and climates into the catalogue tables.
import { fileURLToPath } from 'node:url';
import { drizzle } from 'drizzle-orm/postgres-js';
import { migrate } from 'drizzle-orm/postgres-js/migrator';
import postgres from 'postgres';
import { isMainModule } from './main-module.mjs';
import { environmentOrExit } from '../src/lib/server/env.js';
import { syncBuiltInCatalogue } from '../src/lib/server/catalogue/sync';

export async function migrateDatabase(url: string): Promise<void> {
	const client = postgres(url, { max: 1, onnotice: () => {} });
	try {
		const db = drizzle(client);
		await migrate(db, { migrationsFolder: fileURLToPath(new URL('../drizzle', import.meta.url)) });
		// The built-in catalogue follows the engine in every database, demo or test.
		await syncBuiltInCatalogue(db);
	} finally {
		await client.end();
	}
}

if (isMainModule(import.meta.url)) {
	const url = environmentOrExit().databaseUrl;
	await migrateDatabase(url);
	console.log('Migrations applied');
}
