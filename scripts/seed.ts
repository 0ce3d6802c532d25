// Seeds the demo scenario once. Idempotent: rows that exist are left as they are.
import { drizzle } from 'drizzle-orm/postgres-js';
import postgres from 'postgres';
import { isMainModule } from './main-module.mjs';
import { environmentOrExit, parseEnvironment } from '../src/lib/server/env.js';
import { defaultFeeding, referenceClimateSlug } from '../src/lib/care';
import { hashPassword } from '../src/lib/server/auth/password';
import { nurserySettings, users } from '../src/lib/server/db/schema';
import { seedBoard } from './seed-board';
import { DEMO_ACCOUNTS, DEMO_NURSERY, DEMO_PASSWORD } from './demo.mjs';
import { seedSales } from './seed-sales';

export async function seedDemo(url: string): Promise<void> {
	// Plans are stored through the app's own modules, which connect to DATABASE_URL: seed that database.
	if (parseEnvironment().databaseUrl !== url) throw new Error(`seedDemo(${url}): set DATABASE_URL to the database being seeded`);
	const { regeneratePlan } = await import('../src/lib/server/plans/regenerate');
	const { db: appDb } = await import('../src/lib/server/db');
	const storePlan = async (plantId: number) => void (await appDb.transaction((tx) => regeneratePlan(tx, plantId, { kind: 'created' })));
	const client = postgres(url, { max: 1, onnotice: () => {} });
	const db = drizzle(client);
	try {
		await db
			.insert(nurserySettings)
			.values({
				id: 1,
				...DEMO_NURSERY,
				units: 'metric',
				timeZone: 'UTC',
				defaultClimate: referenceClimateSlug,
				fertilizerName: `Kestrel Hollow banana mix ${defaultFeeding.npk.join('-')}`,
				npk: defaultFeeding.npk,
				restrictedMonths: defaultFeeding.restrictedMonths,
				demo: true
			})
			.onConflictDoNothing();
		const passwordHash = await hashPassword(DEMO_PASSWORD);
		const now = new Date();
		await db
			.insert(users)
			.values(DEMO_ACCOUNTS.map((a) => ({ ...a, role: a.role as 'owner' | 'staff' | 'gardener', passwordHash, emailVerifiedAt: now })))
			.onConflictDoNothing({ target: users.email });
		await seedSales(db, storePlan);
		await seedBoard();
	} finally {
		await client.end();
	}
}

if (isMainModule(import.meta.url)) {
	const url = environmentOrExit().databaseUrl;
	await seedDemo(url);
	const { closeDb } = await import('../src/lib/server/db');
	await closeDb();
	console.log('Demo scenario seeded');
}
