/**
 * One source for every bound: whatever the shared schema accepts, the engine plans, and whatever
 * the engine refuses, the schema refuses first (so no path can turn a refusal into a 500).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computePlan } from '../../../src/lib/care/plan';
import { PlanInputError } from '../../../src/lib/care/validate';
import { PLAN_BOUNDS } from '../../../src/lib/care/vocabulary';
import { climates, findCultivar } from '../../../src/lib/care/catalogue';
import { planBodySchema } from '../../../src/lib/schema/plan';

const near = (min: number, max: number) =>
	fc.oneof(fc.constantFrom(min - 1, min, max, max + 1, min + 0.5), fc.double({ min: min - 5, max: max + 5, noNaN: true }));
const day = fc.integer({ min: 1, max: 28 }).map((d) => String(d).padStart(2, '0'));
const date = fc
	.tuple(fc.integer({ min: PLAN_BOUNDS.year.min - 2, max: PLAN_BOUNDS.year.max + 2 }), fc.integer({ min: 1, max: 12 }), day)
	.map(([y, m, d]) => `${String(y).padStart(4, '0')}-${String(m).padStart(2, '0')}-${d}`);
const nearbyDate = fc.tuple(fc.integer({ min: 2024, max: 2032 }), fc.integer({ min: 1, max: 12 }), day).map(([y, m, d]) => `${y}-${String(m).padStart(2, '0')}-${d}`);
const randomMilestones = fc.record(
	{ flagLeafOn: nearbyDate, shotOn: nearbyDate, harvestedOn: nearbyDate, cutBackOn: nearbyDate, lostOn: nearbyDate, leafCount: fc.record({ on: nearbyDate, leaves: near(0, 80) }) },
	{ requiredKeys: [] }
);
/** A stem's log in life order, days after 2026-01-01. */
const orderedMilestones = fc.array(fc.integer({ min: 0, max: 900 }), { minLength: 3, maxLength: 3 }).map((offsets) => {
	const [flag, shot, harvest] = offsets.sort((a, b) => a - b).map((d) => new Date(Date.UTC(2026, 0, 1 + d)).toISOString().slice(0, 10));
	return { flagLeafOn: flag, shotOn: shot, harvestedOn: harvest };
});
const milestones = fc.oneof(orderedMilestones, randomMilestones);

const body = fc.record({
	cultivar: fc.constant('grand-nain'),
	plantedOn: fc.oneof(date, fc.constant('2025-03-15')),
	ageAtPlantingWeeks: fc.oneof(near(PLAN_BOUNDS.ageAtPlantingWeeks.min, PLAN_BOUNDS.ageAtPlantingWeeks.max), fc.integer({ min: 0, max: 104 })),
	climate: fc.oneof(
		fc.constantFrom(...climates.map((c) => ({ monthlyMeanC: c.monthlyMeanC }))),
		fc.array(near(PLAN_BOUNDS.monthlyMeanC.min, PLAN_BOUNDS.monthlyMeanC.max), { minLength: 12, maxLength: 12 }).map((m) => ({ monthlyMeanC: m })),
		fc.array(fc.double({ min: 12, max: 30, noNaN: true }), { minLength: 12, maxLength: 12 }).map((m) => ({ monthlyMeanC: m }))
	),
	observed: fc.option(milestones, { nil: undefined, freq: 2 }),
	observedFollowers: fc.option(fc.array(milestones, { maxLength: 2 }), { nil: undefined, freq: 2 })
});

type Body = typeof body extends fc.Arbitrary<infer T> ? T : never;

function engineRefuses(b: Body): boolean {
	try {
		computePlan({ ...b, cultivar: findCultivar(b.cultivar)! });
		return false;
	} catch (e) {
		if (e instanceof PlanInputError) return true;
		throw e;
	}
}

describe('schema and engine share their bounds', () => {
	it('the schema accepts exactly what the engine plans', () => {
		const seen = { accepted: 0, refused: 0 };
		fc.assert(
			fc.property(body, (b) => {
				const clean = JSON.parse(JSON.stringify(b));
				const accepted = planBodySchema.safeParse(clean).success;
				seen[accepted ? 'accepted' : 'refused']++;
				expect(accepted).toBe(!engineRefuses(clean));
			}),
			{ numRuns: 400, seed: 20261202 }
		);
		// Both sides of every bound were tried.
		expect(seen.accepted).toBeGreaterThan(40);
		expect(seen.refused).toBeGreaterThan(40);
	}, 120_000);
});
