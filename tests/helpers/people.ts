import { db } from '../../src/lib/server/db';
import { cultivars, plants, users } from '../../src/lib/server/db/schema';
import type { Role } from '../../src/lib/schema/auth';
import { uniqueEmail } from './db';

/** A confirmed account straight in the table (services under test only need its id and role). */
export async function person(role: Role, name = 'Test Person'): Promise<{ id: number; role: Role; email: string; name: string }> {
	const email = uniqueEmail(role);
	const [row] = await db.insert(users).values({ email, name, role, passwordHash: 'not-a-real-hash', emailVerifiedAt: new Date() }).returning();
	return { id: row.id, role, email, name };
}

/** A planted plant of the gardener's, with the fields the nursery's table keeps current. */
export async function plantOf(gardenerId: number, over: Partial<typeof plants.$inferInsert> = {}): Promise<number> {
	const [cultivar] = await db.select({ id: cultivars.id }).from(cultivars).limit(1);
	const [row] = await db
		.insert(plants)
		.values({ cultivarId: cultivar.id, soldOn: '2026-03-01', ageAtSaleWeeks: 12, gardenerId, plantedOn: '2026-03-08', ageAtPlantingWeeks: 13, claimedAt: new Date(), ...over })
		.returning({ id: plants.id });
	return row.id;
}
