// Applies the committed SQL migrations in drizzle/ with drizzle-orm's migrator.
import { fileURLToPath } from 'node:url';
import { drizzle } from 'drizzle-orm/postgres-js';
import { migrate } from 'drizzle-orm/postgres-js/migrator';
import postgres from 'postgres';
import { isMainModule } from './main-module.mjs';
import { environmentOrExit } from '../src/lib/server/env.js';

export async function migrateDatabase(url: string): Promise<void> {
	const client = postgres(url, { max: 1, onnotice: () => {} });
	try {
		await migrate(drizzle(client), { migrationsFolder: fileURLToPath(new URL('../drizzle', import.meta.url)) });
	} finally {
		await client.end();
	}
}

if (isMainModule(import.meta.url)) {
	const url = environmentOrExit().databaseUrl;
	await migrateDatabase(url);
	console.log('Migrations applied');
}
