import { asc, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '../../../src/lib/server/db';
import { milestones, planChanges, planSteps, plants } from '../../../src/lib/server/db/schema';
import { regeneratePlan } from '../../../src/lib/server/plans/regenerate';
import { insertGardener, insertPlant } from '../../helpers/plants';

const stepsOf = (plantId: number) => db.select().from(planSteps).where(eq(planSteps.plantId, plantId)).orderBy(asc(planSteps.likely), asc(planSteps.id));

describe('stored plan regeneration', () => {
	it('writes the plan once, with a uid per step and the plant row’s stage and next step', async () => {
		const gardener = await insertGardener();
		const plant = await insertPlant({ gardenerId: gardener.id });
		const steps = await stepsOf(plant.id);
		expect(steps.length).toBeGreaterThan(30);
		expect(new Set(steps.map((s) => s.uid)).size).toBe(steps.length);
		const [row] = await db.select().from(plants).where(eq(plants.id, plant.id));
		expect(row!.stage).not.toBeNull();
		expect(row!.planChangedAt).not.toBeNull();
		expect(steps.some((s) => s.likely === row!.nextStepOn && s.kind === row!.nextStepKind)).toBe(true);
	});

	it('a logged shooting day moves the harvest, keeps every uid, raises the sequence and records the move with its cause', async () => {
		const gardener = await insertGardener();
		const plant = await insertPlant({ gardenerId: gardener.id });
		const before = await stepsOf(plant.id);
		const shooting = before.find((s) => s.kind === 'shooting' && s.generation === 0)!;
		const harvest = before.find((s) => s.kind === 'harvest' && s.generation === 0)!;
		const shotOn = new Date(Date.parse(shooting.likely) + 30 * 86_400_000).toISOString().slice(0, 10);
		const result = await db.transaction(async (tx) => {
			await tx.insert(milestones).values({ plantId: plant.id, kind: 'shooting', on: shotOn });
			return regeneratePlan(tx, plant.id, { kind: 'milestone-logged', milestoneKind: 'shooting', on: shotOn });
		});
		const after = await stepsOf(plant.id);
		const beforeByIdentity = new Map(before.map((s) => [`${s.generation}|${s.kind}|${s.occurrence}`, s]));
		for (const s of after) {
			const old = beforeByIdentity.get(`${s.generation}|${s.kind}|${s.occurrence}`);
			if (old) expect(s.uid).toBe(old.uid);
		}
		const harvestAfter = after.find((s) => s.uid === harvest.uid)!;
		expect(harvestAfter.likely > harvest.likely).toBe(true);
		expect(harvestAfter.sequence).toBe(harvest.sequence + 1);
		const move = result!.moved.find((m) => m.uid === harvest.uid)!;
		expect(move.days).toBe((Date.parse(harvestAfter.likely) - Date.parse(harvest.likely)) / 86_400_000);
		const recorded = await db.select().from(planChanges).where(eq(planChanges.plantId, plant.id));
		const recordedHarvest = recorded.find((r) => r.stepUid === harvest.uid)!;
		expect(recordedHarvest.days).toBe(move.days);
		expect(recordedHarvest.cause).toEqual({ kind: 'milestone-logged', milestoneKind: 'shooting', on: shotOn });
		const [row] = await db.select().from(plants).where(eq(plants.id, plant.id));
		expect(row!.lastMilestoneKind).toBe('shooting');
		expect(row!.lastMilestoneOn).toBe(shotOn);
	});

	it('regenerating unchanged inputs writes nothing and records no move', async () => {
		const gardener = await insertGardener();
		const plant = await insertPlant({ gardenerId: gardener.id });
		const before = await stepsOf(plant.id);
		const result = await db.transaction((tx) => regeneratePlan(tx, plant.id, { kind: 'units' }));
		expect(result!.moved).toEqual([]);
		expect(result!.changed + result!.added + result!.removed).toBe(0);
		expect(await stepsOf(plant.id)).toEqual(before);
	});

	it('an unclaimed plant has no plan', async () => {
		const gardener = await insertGardener();
		const plant = await insertPlant({ gardenerId: gardener.id });
		await db.update(plants).set({ plantedOn: null }).where(eq(plants.id, plant.id));
		expect(await db.transaction((tx) => regeneratePlan(tx, plant.id, { kind: 'created' }))).toBeNull();
	});
});
