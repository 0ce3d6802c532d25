// The plant row's stage and next step (the nursery's table sorts and filters by them) are kept
// current by the worker after the next step's day has passed, from the stored steps alone.
import { asc, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '../../../src/lib/server/db';
import { planSteps, plants } from '../../../src/lib/server/db/schema';
import { plansRepository } from '../../../src/lib/server/plans/repository';
import { createSummaryRefresher } from '../../../src/lib/server/plans/summary-refresh';
import { insertGardener, insertPlant } from '../../helpers/plants';

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
