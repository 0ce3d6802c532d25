/**
 * Gardeners and claimed plants with stored plans, written straight into the tables (what the
 * plant pages' regeneration writes), for delivery tests and the dispatch benchmark.
 */
import { eq, sql } from 'drizzle-orm';
import { climates, computePlan, cultivars, defaultFeeding, type Plan } from '../../src/lib/care';
import type { Db } from '../../src/lib/server/db';
import { climateProfiles, cultivars as cultivarRows, planSteps, plants, users } from '../../src/lib/server/db/schema';

let counter = 0;

export async function insertGardener(db: Db, name = 'Test Gardener'): Promise<{ id: number; email: string }> {
	const email = `gardener.${process.pid}.${Date.now().toString(36)}.${++counter}@example.test`;
	const [row] = await db
		.insert(users)
		.values({ email, name, passwordHash: 'not-a-password', role: 'gardener', emailVerifiedAt: new Date() })
		.returning({ id: users.id });
	return { id: row.id, email };
}

export function planOf(plantedOn: string, cultivarIndex = 0): Plan {
	return computePlan({ cultivar: cultivars[cultivarIndex], plantedOn, ageAtPlantingWeeks: 12, climate: climates[0], feeding: defaultFeeding, generations: 3 });
}

/** Step rows for a plan: occurrence numbers each repeat of a kind within a generation. */
export function stepRows(plantId: number, plan: Plan, changedAt: Date) {
	const seen = new Map<string, number>();
	return plan.steps.map((s) => {
		const key = `${s.generation}:${s.kind}`;
		const occurrence = seen.get(key) ?? 0;
		seen.set(key, occurrence + 1);
		return {
			plantId,
			generation: s.generation,
			kind: s.kind,
			occurrence,
			title: s.title,
			detail: s.detail,
			earliest: s.earliest,
			likely: s.likely,
			latest: s.latest,
			amount: s.amount ?? null,
			nutrients: s.nutrients ?? null,
			cautions: s.cautions ?? null,
			guide: s.guide ?? null,
			observed: s.observed ?? false,
			restricted: Boolean(s.restricted),
			changedAt
		};
	});
}

/** A claimed plant of the first cultivar in the reference climate, with its stored three-generation plan. */
export async function insertPlant(db: Db, gardenerId: number, plantedOn = '2026-03-01', changedAt = new Date('2026-02-20T10:00:00Z')) {
	const [cultivar] = await db.select({ id: cultivarRows.id }).from(cultivarRows).where(eq(cultivarRows.slug, cultivars[0].slug));
	const [climate] = await db.select({ id: climateProfiles.id }).from(climateProfiles).where(eq(climateProfiles.slug, climates[0].slug));
	const [plant] = await db
		.insert(plants)
		.values({
			cultivarId: cultivar.id,
			soldOn: plantedOn,
			ageAtSaleWeeks: 12,
			gardenerId,
			claimedAt: changedAt,
			plantedOn,
			ageAtPlantingWeeks: 12,
			climateProfileId: climate.id,
			units: 'metric',
			planChangedAt: changedAt
		})
		.returning({ id: plants.id });
	const plan = planOf(plantedOn);
	await db.insert(planSteps).values(stepRows(plant.id, plan, changedAt));
	return { id: plant.id, plan };
}

/** Moves one step by `days` as a regeneration would: new dates, sequence raised, change time and the plant's plan time set. */
export async function moveStep(db: Db, stepId: number, days: number, at: Date): Promise<void> {
	await db.execute(sql`
		update plan_steps set earliest = earliest + ${days}::int, likely = likely + ${days}::int, latest = latest + ${days}::int,
			sequence = sequence + 1, changed_at = ${at.toISOString()} where id = ${stepId}`);
	await db.execute(sql`update plants set plan_changed_at = ${at.toISOString()} where id = (select plant_id from plan_steps where id = ${stepId})`);
}
