import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computePlan, findCultivar, findClimate, referenceClimateSlug, type PlanInput, type Step } from '../../../src/lib/care';
import { diffPlan, identityKey, numberSteps, storedContent, type StoredStep } from '../../../src/lib/plants/plan-diff';

const base: PlanInput = {
	cultivar: findCultivar('grand-nain')!,
	plantedOn: '2026-03-01',
	ageAtPlantingWeeks: 12,
	climate: { monthlyMeanC: findClimate(referenceClimateSlug)!.monthlyMeanC }
};

/** What the database would hold after writing a plan: each identity with its own uid. */
function store(steps: Step[], uids = new Map<string, string>()): StoredStep[] {
	return numberSteps(steps).map((s, i) => {
		const content = storedContent(s);
		return { ...content, uid: uids.get(identityKey(content)) ?? `uid-${i}-${identityKey(content)}`, sequence: 0 };
	});
}

/** Applies a diff the way the regeneration writes it, returning the new stored plan. */
function apply(stored: StoredStep[], computed: Step[]): StoredStep[] {
	const d = diffPlan(stored, computed);
	const byUid = new Map(stored.map((s) => [s.uid, s]));
	for (const r of d.removed) byUid.delete(r.uid);
	for (const c of d.changed) byUid.set(c.uid, { ...c.content, uid: c.uid, sequence: c.sequence });
	d.added.forEach((a, i) => byUid.set(`new-${i}-${identityKey(a)}`, { ...a, uid: `new-${i}-${identityKey(a)}`, sequence: 0 }));
	return [...byUid.values()];
}

describe('matching a recomputed plan against the stored one', () => {
	it('numbers repeated feedings in date order and leaves single steps at 0', () => {
		const numbered = numberSteps(computePlan(base).steps);
		const feedings = numbered.filter((s) => s.kind === 'feeding');
		expect(feedings.length).toBeGreaterThan(3);
		expect(feedings.map((s) => s.occurrence)).toEqual(feedings.map((_, i) => i));
		expect(numbered.find((s) => s.kind === 'harvest' && s.generation === 1)?.occurrence).toBe(0);
		expect(new Set(numbered.map(identityKey)).size).toBe(numbered.length);
	});

	it('an unchanged plan writes nothing', () => {
		const plan = computePlan(base).steps;
		const d = diffPlan(store(plan), plan);
		expect(d.changed).toEqual([]);
		expect(d.added).toEqual([]);
		expect(d.removed).toEqual([]);
		expect(d.unchanged.length).toBe(plan.length);
	});

	it('a logged shooting day moves the harvest by the days between the two forecasts, under the same uid', () => {
		const before = computePlan(base).steps;
		const stored = store(before);
		const forecastShooting = before.find((s) => s.kind === 'shooting' && s.generation === 0)!.likely;
		// Logged 20 days after the forecast.
		const shotOn = new Date(Date.parse(forecastShooting) + 20 * 86_400_000).toISOString().slice(0, 10);
		const after = computePlan({ ...base, observed: { shotOn } }).steps;
		const d = diffPlan(stored, after);
		const harvestBefore = stored.find((s) => s.kind === 'harvest' && s.generation === 0)!;
		const harvestMove = d.moved.find((m) => m.kind === 'harvest' && m.generation === 0)!;
		const harvestAfter = after.find((s) => s.kind === 'harvest' && s.generation === 0)!;
		expect(harvestMove.uid).toBe(harvestBefore.uid);
		expect(harvestMove.fromLikely).toBe(harvestBefore.likely);
		expect(harvestMove.toLikely).toBe(harvestAfter.likely);
		expect(harvestMove.days).toBe((Date.parse(harvestAfter.likely) - Date.parse(harvestBefore.likely)) / 86_400_000);
		expect(harvestMove.days).toBeGreaterThan(0);
		const shooting = d.changed.find((c) => c.content.kind === 'shooting' && c.content.generation === 0)!;
		expect(shooting.content.observed).toBe(true);
		expect(shooting.sequence).toBe(1);
		// The planting step did not move and is not rewritten.
		expect(d.unchanged.some((s) => s.kind === 'planting')).toBe(true);
	});

	it('every step keeps its uid where it still exists, whatever the inputs become', () => {
		const cultivars = ['grand-nain', 'williams', 'dwarf-cavendish', 'silk'].filter((c) => findCultivar(c));
		fc.assert(
			fc.property(
				fc.integer({ min: -200, max: 200 }),
				fc.integer({ min: 0, max: 52 }),
				fc.constantFrom(...cultivars),
				fc.constantFrom<'metric' | 'imperial'>('metric', 'imperial'),
				(shiftDays, age, cultivar, units) => {
					const first = computePlan(base).steps;
					const stored = store(first);
					const plantedOn = new Date(Date.parse(base.plantedOn) + shiftDays * 86_400_000).toISOString().slice(0, 10);
					const next = computePlan({ ...base, plantedOn, ageAtPlantingWeeks: age, cultivar: findCultivar(cultivar)!, units }).steps;
					const rewritten = apply(stored, next);
					const oldByKey = new Map(stored.map((s) => [identityKey(s), s.uid]));
					for (const s of rewritten) {
						const key = identityKey(s);
						if (oldByKey.has(key)) expect(s.uid).toBe(oldByKey.get(key));
					}
					// The stored plan is exactly the new plan, one row per identity.
					expect(rewritten.map(identityKey).sort()).toEqual(numberSteps(next).map(identityKey).sort());
					// Applying the same plan again changes nothing.
					const again = diffPlan(rewritten, next);
					expect(again.changed.length + again.added.length + again.removed.length).toBe(0);
				}
			),
			{ numRuns: 40 }
		);
	});

	it('feedings dropped from a shorter plan are removed, and new ones added, by identity', () => {
		const stored = store(computePlan(base).steps);
		const storedFeedings = stored.filter((s) => s.kind === 'feeding').length;
		// A warmer garden finishes three generations sooner: fewer monthly feedings.
		const warm = computePlan({ ...base, climate: { monthlyMeanC: base.climate.monthlyMeanC.map((t) => t + 4) } }).steps;
		const d = diffPlan(stored, warm);
		const warmFeedings = warm.filter((s) => s.kind === 'feeding').length;
		expect(warmFeedings).toBeLessThan(storedFeedings);
		expect(d.removed.filter((s) => s.kind === 'feeding').length).toBe(storedFeedings - warmFeedings);
		expect(d.removed.every((s) => s.kind === 'feeding' && s.occurrence >= warmFeedings)).toBe(true);
		expect(d.added).toEqual([]);
	});
});

describe('comparing with what the database gives back', () => {
	it('an amount whose keys come back in another order is the same amount', () => {
		const plan = computePlan(base).steps;
		const stored = store(plan).map((s) => (s.amount ? { ...s, amount: { unit: s.amount.unit, measure: s.amount.measure, value: s.amount.value } } : s));
		expect(diffPlan(stored, plan).changed).toEqual([]);
	});
});
