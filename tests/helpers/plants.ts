/** Test fixtures: gardeners and claimed plants written straight into the test database. */
import { eq, sql } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { climateProfiles, cultivars, plants, users } from '../../src/lib/server/db/schema';
import { regeneratePlan } from '../../src/lib/server/plans/regenerate';
import { uniqueEmail } from './db';

export async function insertGardener(name = 'Test Gardener', role: 'gardener' | 'staff' | 'owner' = 'gardener') {
	const [user] = await db
		.insert(users)
		.values({ email: uniqueEmail(role), name, passwordHash: 'not-a-real-hash', role, emailVerifiedAt: new Date() })
		.returning();
	return user!;
}

export interface PlantFixture {
	gardenerId: number;
	cultivar?: string;
	climate?: string;
	plantedOn?: string;
	ageAtPlantingWeeks?: number;
	units?: 'metric' | 'imperial';
}

/** A claimed, planted plant with its stored plan written. */
export async function insertPlant(f: PlantFixture) {
	const [cultivar] = await db.select().from(cultivars).where(eq(cultivars.slug, f.cultivar ?? 'grand-nain'));
	const [climate] = await db.select().from(climateProfiles).where(eq(climateProfiles.slug, f.climate ?? 'south-florida-coast'));
	const plantedOn = f.plantedOn ?? '2026-03-01';
	return db.transaction(async (tx) => {
		const [plant] = await tx
			.insert(plants)
			.values({
				cultivarId: cultivar!.id,
				soldOn: plantedOn,
				ageAtSaleWeeks: f.ageAtPlantingWeeks ?? 12,
				claimedAt: new Date(),
				gardenerId: f.gardenerId,
				plantedOn,
				ageAtPlantingWeeks: f.ageAtPlantingWeeks ?? 12,
				climateProfileId: climate!.id,
				units: f.units ?? 'metric'
			})
			.returning();
		await regeneratePlan(tx, plant!.id, { kind: 'created' });
		return plant!;
	});
}

/**
 * Moves one stored step by `days` the way a regeneration records a move (new dates, sequence
 * raised, change time, the plant's plan time), at a fixed time a test can assert on.
 */
export async function moveStep(stepId: number, days: number, at: Date): Promise<void> {
	await db.execute(sql`
		update plan_steps set earliest = earliest + ${days}::int, likely = likely + ${days}::int, latest = latest + ${days}::int,
			sequence = sequence + 1, changed_at = ${at.toISOString()} where id = ${stepId}`);
	await db.execute(sql`update plants set plan_changed_at = ${at.toISOString()} where id = (select plant_id from plan_steps where id = ${stepId})`);
}

/** Pins every step's and the plan's change time, so tests can assert DTSTAMP and Last-Modified. */
export async function pinChangeTime(plantId: number, at: Date): Promise<void> {
	await db.execute(sql`update plan_steps set changed_at = ${at.toISOString()} where plant_id = ${plantId}`);
	await db.execute(sql`update plants set plan_changed_at = ${at.toISOString()} where id = ${plantId}`);
}
