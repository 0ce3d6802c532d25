// Applies the committed SQL migrations in drizzle/ with drizzle-orm's migrator.
import { fileURLToPath } from 'node:url';
import { drizzle } from 'drizzle-orm/postgres-js';
import { migrate } from 'drizzle-orm/postgres-js/migrator';
import postgres from 'postgres';
import { isMainModule } from './main-module.mjs';

export async function migrateDatabase(url: string): Promise<void> {
	const client = postgres(url, { max: 1, onnotice: () => {} });
	try {
		await migrate(drizzle(client), { migrationsFolder: fileURLToPath(new URL('../drizzle', import.meta.url)) });
	} finally {
		await client.end();
	}
}

if (isMainModule(import.meta.url)) {
	const url = process.env.DATABASE_URL;
	if (!url) throw new Error('DATABASE_URL is not set');
	await migrateDatabase(url);
	console.log('Migrations applied');
}
