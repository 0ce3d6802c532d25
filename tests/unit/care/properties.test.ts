/** Property tests (fast-check): invariants of every plan. */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computePlan } from '../../../src/lib/care/plan';
import { annualThermalTime, leafEmissionRate } from '../../../src/lib/care/thermal';
import { MIN_ANNUAL_DEGREE_DAYS, climateCoolness } from '../../../src/lib/care/model';
import { climates, cultivars } from '../../../src/lib/care/catalogue';
import type { Plan, PlanInput, Step } from '../../../src/lib/care/types';
import { days } from './helpers';

const coolnessOf = (monthlyMeanC: number[]) => climateCoolness(annualThermalTime(monthlyMeanC, leafEmissionRate));

const isoDate = (from: number, to: number) =>
	fc.integer({ min: Date.UTC(from, 0, 1) / 86_400_000, max: Date.UTC(to, 11, 31) / 86_400_000 }).map((d) => new Date(d * 86_400_000).toISOString().slice(0, 10));

const monthlyMeans = fc.oneof(
	fc.constantFrom(...climates.map((c) => c.monthlyMeanC)),
	fc.array(fc.double({ min: 12, max: 32, noNaN: true }), { minLength: 12, maxLength: 12 })
);

const planInput: fc.Arbitrary<PlanInput> = fc
	.record({
		cultivar: fc.constantFrom(...cultivars),
		monthlyMeanC: monthlyMeans,
		plantedOn: isoDate(2020, 2030),
		ageAtPlantingWeeks: fc.integer({ min: 0, max: 104 }),
		shotAfterDays: fc.option(fc.integer({ min: 30, max: 900 }), { nil: undefined }),
		units: fc.constantFrom('metric' as const, 'imperial' as const)
	})
	.filter((r) => annualThermalTime(r.monthlyMeanC) >= MIN_ANNUAL_DEGREE_DAYS)
	.map((r) => ({
		cultivar: r.cultivar,
		climate: { monthlyMeanC: r.monthlyMeanC },
		plantedOn: r.plantedOn,
		ageAtPlantingWeeks: r.ageAtPlantingWeeks,
		units: r.units,
		...(r.shotAfterDays === undefined
			? {}
			: { observed: { shotOn: new Date(Date.parse(r.plantedOn) + r.shotAfterDays * 86_400_000).toISOString().slice(0, 10) } })
	}));

const LIFE_ORDER = ['planting', 'followers', 'shooting', 'harvest', 'cut-back', 'stem-removal'] as const;

function key(s: Step, index: number): string {
	return `${s.kind}/${s.generation}/${index}`;
}

/** Steps keyed by kind + generation + running index within that pair. */
function keyed(plan: Plan): Map<string, Step> {
	const counts = new Map<string, number>();
	const out = new Map<string, Step>();
	for (const s of plan.steps) {
		const k = `${s.kind}/${s.generation}`;
		const i = counts.get(k) ?? 0;
		counts.set(k, i + 1);
		out.set(key(s, i), s);
	}
	return out;
}

const TIMEOUT = 300_000;
// A fixed seed keeps CI repeatable; CARE_PROPERTY_SEED=random (or a number) explores further.
const seedEnv = process.env.CARE_PROPERTY_SEED;
fc.configureGlobal({ seed: seedEnv === 'random' ? Date.now() : Number(seedEnv ?? 20261201) });
const RUNS = { numRuns: Number(process.env.CARE_PROPERTY_RUNS ?? 300) };

describe('plan invariants (fast-check)', () => {
	it('every window is ordered and contains its likely date; steps are sorted by likely; dates are YYYY-MM-DD', () => {
		fc.assert(
			fc.property(planInput, (inp) => {
				const plan = computePlan(inp);
				for (const s of plan.steps) {
					expect(s.earliest <= s.likely && s.likely <= s.latest).toBe(true);
					expect(s.likely).toMatch(/^\d{4}-\d{2}-\d{2}$/);
				}
				for (let i = 1; i < plan.steps.length; i++) expect(plan.steps[i - 1].likely <= plan.steps[i].likely).toBe(true);
			}),
			RUNS
		);
	}, TIMEOUT);
	it('along each generation: planting ≤ followers ≤ shooting ≤ harvest ≤ cut-back ≤ stem-removal', () => {
		fc.assert(
			fc.property(planInput, (inp) => {
				const plan = computePlan(inp);
				const generations = new Set(plan.steps.map((s) => s.generation));
				expect(generations.size).toBeGreaterThanOrEqual(3);
				const planting = plan.steps.find((s) => s.kind === 'planting')!.likely;
				for (const g of generations) {
					const chain = LIFE_ORDER.map((k) => (k === 'planting' ? planting : plan.steps.find((s) => s.kind === k && s.generation === g)?.likely)).filter(
						(d): d is string => d !== undefined
					);
					for (let i = 1; i < chain.length; i++) expect(chain[i - 1] <= chain[i]).toBe(true);
				}
			}),
			RUNS
		);
	}, TIMEOUT);
	it('amounts and nutrients are never negative', () => {
		fc.assert(
			fc.property(planInput, (inp) => {
				for (const s of computePlan(inp).steps) {
					if (s.amount) expect(s.amount.value).toBeGreaterThanOrEqual(0);
					if (s.nutrients) for (const v of [s.nutrients.n, s.nutrients.p, s.nutrients.k]) expect(v).toBeGreaterThanOrEqual(0);
				}
			}),
			RUNS
		);
	}, TIMEOUT);
	it('same input → deep-equal plan', () => {
		fc.assert(
			fc.property(planInput, (inp) => {
				expect(computePlan(structuredClone(inp))).toEqual(computePlan(inp));
			}),
			{ numRuns: 100 }
		);
	}, TIMEOUT);
	// Below about 1e-6 °C a "colder" climate differs only in floating-point rounding of the
	// accumulated degree-days, which can move a date across a day boundary either way.
	// A colder garden's windows are also wider (COOL_WINDOW_GAIN): its window may open earlier, but
	// its likely day and the window's close never come sooner; where both gardens are at least as
	// warm as the reference, the windows are as wide and the opening cannot come sooner either.
	it('a colder climate (every month d ≥ 0 °C cooler) never makes any step likely or due earlier', () => {
		fc.assert(
			fc.property(planInput, fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 6, noNaN: true })), (inp, d) => {
				const colder = inp.climate.monthlyMeanC.map((t) => t - d);
				fc.pre(annualThermalTime(colder) >= MIN_ANNUAL_DEGREE_DAYS);
				const warm = keyed(computePlan(inp));
				const cold = keyed(computePlan({ ...inp, climate: { monthlyMeanC: colder } }));
				const sameWidth = coolnessOf(colder) === 0;
				for (const [k, w] of warm) {
					const c = cold.get(k);
					if (!c) continue;
					// Counted back from a logged flower, the flag leaf comes one leaf interval before it,
					// and a colder garden's leaf interval is longer: that step may only move earlier.
					if (k === 'flag-leaf/0/0' && inp.observed?.shotOn) continue;
					if (sameWidth) expect(c.earliest >= w.earliest, `${k} earliest`).toBe(true);
					expect(c.likely >= w.likely, `${k} likely`).toBe(true);
					expect(c.latest >= w.latest, `${k} latest`).toBe(true);
				}
			}),
			RUNS
		);
	}, TIMEOUT);
	it('a logged shooting date fixes the harvest regardless of planting date and age', () => {
		fc.assert(
			fc.property(planInput, isoDate(2020, 2024), fc.integer({ min: 0, max: 104 }), (inp, otherPlanting, otherAge) => {
				const shotOn = '2025-06-01';
				fc.pre(inp.plantedOn <= shotOn);
				const a = computePlan({ ...inp, observed: { shotOn } });
				const b = computePlan({ ...inp, plantedOn: otherPlanting, ageAtPlantingWeeks: otherAge, observed: { shotOn } });
				const h = (p: Plan) => p.steps.find((s) => s.kind === 'harvest' && s.generation === 0)!;
				expect(h(b)).toEqual(h(a));
				expect(days(shotOn, h(a).likely)).toBeGreaterThan(0);
			}),
			{ numRuns: 150 }
		);
	}, TIMEOUT);
});
