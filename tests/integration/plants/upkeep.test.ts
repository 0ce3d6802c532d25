// Plan upkeep in the worker: plans an older engine wrote are regenerated with the current one, and
// the plant row's stage and next step (the nursery's table sorts and filters by them) are kept
// current after the next step's day has passed, from the stored steps alone.
import { asc, eq, sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '../../../src/lib/server/db';
import { planChanges, planSteps, plants } from '../../../src/lib/server/db/schema';
import { describeCause } from '../../../src/lib/plants/changes';
import { engineFingerprint } from '../../../src/lib/server/plans/engine';
import { regeneratePlan } from '../../../src/lib/server/plans/regenerate';
import { plansRepository } from '../../../src/lib/server/plans/repository';
import { createOutdatedPlanRegenerator, createSummaryRefresher } from '../../../src/lib/server/plans/upkeep';
import { insertGardener, insertPlant, moveStep } from '../../helpers/plants';

const rowOf = async (id: number) => (await db.select().from(plants).where(eq(plants.id, id)))[0]!;
const stepsOf = (id: number) => db.select().from(planSteps).where(eq(planSteps.plantId, id)).orderBy(asc(planSteps.id));

/** A refresher that sees only these plants: other test files' plants are not touched mid-run. */
function refresherFor(ids: number[], now: Date) {
	const mine = new Set(ids);
	return createSummaryRefresher({
		repo: { ...plansRepository, staleSummaryIds: async (c, today, limit) => (await plansRepository.staleSummaryIds(c, today, 100_000)).filter((id) => mine.has(id)).slice(0, limit) },
		transaction: (work) => db.transaction(work),
		reader: db,
		timeZone: async () => 'UTC',
		now: () => now
	});
}

describe('refreshing stale plant summaries', () => {
	it('moves the stage and next step on once their day has passed, leaves the stored plan alone, and finds nothing left to do after', async () => {
		const gardener = await insertGardener();
		const plant = await insertPlant({ gardenerId: gardener.id, plantedOn: '2026-03-01' });
		const before = await rowOf(plant.id);
		const stepsBefore = await stepsOf(plant.id);
		const later = new Date('2027-09-01T12:00:00Z');
		expect(before.nextStepOn! < '2027-09-01').toBe(true);

		const refresh = refresherFor([plant.id], later);
		expect(await refresh(1)).toBe(1);
		const after = await rowOf(plant.id);
		expect(after.nextStepOn === null || after.nextStepOn >= '2027-09-01').toBe(true);
		// Eighteen months on, the plant sold is long past growing leaves.
		expect(after.stage).not.toBe(before.stage);
		const next = stepsBefore.find((s) => s.likely === after.nextStepOn && s.kind === after.nextStepKind);
		expect(next, 'the next step is one of the stored steps').toBeDefined();
		expect(await stepsOf(plant.id)).toEqual(stepsBefore);
		expect(after.planChangedAt).toEqual(before.planChangedAt);

		expect(await refresh(1)).toBe(0);
	});

	it('a plant whose next step is still ahead is not touched', async () => {
		const gardener = await insertGardener();
		const plant = await insertPlant({ gardenerId: gardener.id, plantedOn: '2026-03-01' });
		const before = await rowOf(plant.id);
		expect(await refresherFor([plant.id], new Date(`${before.nextStepOn}T00:00:00Z`))(10)).toBe(0);
		expect(await rowOf(plant.id)).toEqual(before);
	});
});

describe('regenerating plans an older engine wrote', () => {
	/** A regenerator that sees only these plants: other test files' plants are not touched mid-run. */
	function regeneratorFor(ids: number[], regenerate = (id: number) => db.transaction((tx) => regeneratePlan(tx, id, { kind: 'engine' })).then(() => {})) {
		const mine = new Set(ids);
		const logged: string[] = [];
		const run = createOutdatedPlanRegenerator({
			outdatedPlanIds: async (engine, afterId, limit) => (await plansRepository.outdatedPlanIds(db, engine, afterId, 100_000)).filter((id) => mine.has(id)).slice(0, limit),
			regenerate,
			engine: engineFingerprint,
			log: (line) => logged.push(line)
		});
		return { run, logged };
	}

	it('every regeneration stamps the engine that wrote the plan', async () => {
		const plant = await insertPlant({ gardenerId: (await insertGardener()).id });
		expect((await rowOf(plant.id)).planEngine).toBe(engineFingerprint());
		expect(engineFingerprint()).toMatch(/^[0-9a-f]{16}$/);
	});

	it('a plan from another engine is rewritten with today’s dates, the move recorded as the care model’s, then left alone', async () => {
		const plant = await insertPlant({ gardenerId: (await insertGardener()).id });
		const harvest = (await stepsOf(plant.id)).find((s) => s.kind === 'harvest' && s.generation === 0)!;
		// What an older engine might have written: the harvest a month later.
		await moveStep(harvest.id, 30, new Date('2026-06-01T00:00:00Z'));
		await db.execute(sql`update plants set plan_engine = 'an-older-model' where id = ${plant.id}`);

		const { run } = regeneratorFor([plant.id]);
		expect(await run(1)).toBe(1);
		const after = (await stepsOf(plant.id)).find((s) => s.id === harvest.id)!;
		expect(after.likely).toBe(harvest.likely);
		expect(after.uid).toBe(harvest.uid);
		expect((await rowOf(plant.id)).planEngine).toBe(engineFingerprint());
		const [change] = await db.select().from(planChanges).where(eq(planChanges.stepUid, harvest.uid));
		expect(change!.days).toBe(-30);
		expect(describeCause(change!.cause)).toBe('Bunchline’s care model was updated');

		expect(await run(1)).toBe(0);
	});

	it('a plant the engine now refuses is logged and skipped; the run goes on to the next', async () => {
		const [a, b] = [await insertPlant({ gardenerId: (await insertGardener()).id }), await insertPlant({ gardenerId: (await insertGardener()).id })];
		await db.execute(sql`update plants set plan_engine = null where id in (${a.id}, ${b.id})`);
		const { run, logged } = regeneratorFor([a.id, b.id], async (id) => {
			if (id === a.id) throw new Error('the garden climate no longer exists');
			await db.transaction((tx) => regeneratePlan(tx, id, { kind: 'engine' }));
		});
		expect(await run(1)).toBe(1);
		expect(logged).toEqual([`[plants] plant ${a.id}: the plan could not be regenerated (the garden climate no longer exists)`]);
		expect((await rowOf(b.id)).planEngine).toBe(engineFingerprint());
		expect((await rowOf(a.id)).planEngine).toBeNull();
	});
});
