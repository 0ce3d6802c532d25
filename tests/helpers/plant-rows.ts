/** Plants written straight into the tables, so table, export and index tests control every column. */
import { db } from '../../src/lib/server/db';
import { cultivars, marketDays, plants, sales, users } from '../../src/lib/server/db/schema';
import { uniqueEmail } from './db';
import { randomUUID } from 'node:crypto';

let counter = 0;

/** A cultivar of the test's own, so its plants can be told apart from anything else in the database. */
export async function testCultivar(name = 'Test Cultivar') {
	const slug = `test-${process.pid}-${Date.now().toString(36)}-${++counter}`;
	// Retired, so the public catalogue (which lists what is offered) never shows it.
	const [row] = await db.insert(cultivars).values({ slug, name, group: 'AAA', subgroup: 'Cavendish', size: 'medium', parameters: {}, retiredAt: new Date() }).returning();
	return row;
}

export async function testUser(role: 'owner' | 'staff' | 'gardener', name = `Test ${role}`) {
	const [row] = await db.insert(users).values({ email: uniqueEmail(role), name, role, passwordHash: 'x', emailVerifiedAt: new Date() }).returning();
	return row;
}

export async function testMarketDay(on: string, place = 'Marrowby Quay Saturday Market') {
	const [row] = await db.insert(marketDays).values({ on, place: `${place} ${++counter}` }).returning();
	return row;
}

export interface PlantSpec {
	cultivarId: number;
	soldOn: string;
	ageAtSaleWeeks?: number;
	gardenerId?: number | null;
	marketDayId?: number | null;
	stage?: string | null;
	nextStepOn?: string | null;
	nextStepKind?: string | null;
	lastMilestoneOn?: string | null;
	lastMilestoneKind?: string | null;
}

/** One sale per plant, as the stall records it. */
export async function insertPlants(specs: PlantSpec[]) {
	const saleRows = await db
		.insert(sales)
		.values(specs.map((s) => ({ clientId: randomUUID(), cultivarId: s.cultivarId, marketDayId: s.marketDayId ?? null, soldOn: s.soldOn, quantity: 1, pricePerPlantCents: 1800 })))
		.returning({ id: sales.id });
	return db
		.insert(plants)
		.values(
			specs.map((s, i) => ({
				saleId: saleRows[i].id,
				cultivarId: s.cultivarId,
				soldOn: s.soldOn,
				ageAtSaleWeeks: s.ageAtSaleWeeks ?? 12,
				gardenerId: s.gardenerId ?? null,
				claimedAt: s.gardenerId ? new Date() : null,
				stage: s.stage ?? null,
				nextStepOn: s.nextStepOn ?? null,
				nextStepKind: s.nextStepKind ?? null,
				lastMilestoneOn: s.lastMilestoneOn ?? null,
				lastMilestoneKind: s.lastMilestoneKind ?? null
			}))
		)
		.returning();
}
