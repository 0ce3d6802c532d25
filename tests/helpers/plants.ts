/** Test fixtures: gardeners and claimed plants written straight into the test database. */
import { eq } from 'drizzle-orm';
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
