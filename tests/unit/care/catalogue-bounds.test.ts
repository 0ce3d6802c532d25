// The owner's bounds: every built-in value inside them, a source for each, and the engine plans at every extreme.
import { describe, expect, it } from 'vitest';
import {
	CULTIVAR_PARAMETER_BOUNDS,
	CULTIVAR_PARAMETER_NAMES,
	FEEDING_SETTING_BOUNDS,
	climates,
	computePlan,
	cultivars,
	defaultFeeding,
	referenceCultivar,
	type Cultivar
} from '../../../src/lib/care';

const SOURCE = /from memory|published|common practice, no source|\(\w[^)]*\d{4}/;

describe('cultivar parameter bounds', () => {
	it('cover every plan parameter of the engine, each with min < max and where it comes from', () => {
		const engineParameters = Object.entries(referenceCultivar())
			.filter(([, v]) => typeof v === 'object' && v !== null && 'value' in v)
			.map(([k]) => k)
			.sort();
		expect([...CULTIVAR_PARAMETER_NAMES].sort()).toEqual(engineParameters);
		for (const name of CULTIVAR_PARAMETER_NAMES) {
			const b = CULTIVAR_PARAMETER_BOUNDS[name];
			expect(b.min, name).toBeLessThan(b.max);
			expect(b.source, name).toMatch(SOURCE);
		}
	});

	it('hold every built-in cultivar value', () => {
		for (const c of cultivars)
			for (const name of CULTIVAR_PARAMETER_NAMES) {
				const { min, max, integer } = CULTIVAR_PARAMETER_BOUNDS[name];
				const v = c[name].value;
				expect(v, `${c.slug} ${name}`).toBeGreaterThanOrEqual(min);
				expect(v, `${c.slug} ${name}`).toBeLessThanOrEqual(max);
				if (integer) expect(Number.isInteger(v), `${c.slug} ${name}`).toBe(true);
			}
	});

	it('the engine plans a cultivar at every corner of the bounds, in every built-in climate, harvest after shooting', () => {
		const corners = CULTIVAR_PARAMETER_NAMES.reduce<Record<string, number>[]>(
			(acc, name) => acc.flatMap((partial) => [CULTIVAR_PARAMETER_BOUNDS[name].min, CULTIVAR_PARAMETER_BOUNDS[name].max].map((v) => ({ ...partial, [name]: v }))),
			[{}]
		);
		expect(corners).toHaveLength(2 ** CULTIVAR_PARAMETER_NAMES.length);
		for (const corner of corners) {
			const cultivar: Cultivar = { ...referenceCultivar() };
			for (const [name, value] of Object.entries(corner)) (cultivar as unknown as Record<string, unknown>)[name] = { value, source: { kind: 'nursery' } };
			for (const climate of climates) {
				const plan = computePlan({ cultivar, plantedOn: '2026-03-15', ageAtPlantingWeeks: 12, climate, feeding: defaultFeeding });
				const shooting = plan.steps.find((s) => s.kind === 'shooting' && s.generation === 0)!;
				const harvest = plan.steps.find((s) => s.kind === 'harvest' && s.generation === 0)!;
				expect(harvest.likely > shooting.likely, `${JSON.stringify(corner)} in ${climate.slug}`).toBe(true);
			}
		}
	});
});

describe('feeding setting bounds', () => {
	it("hold the engine's own defaults and say where they come from", () => {
		const F = FEEDING_SETTING_BOUNDS;
		for (const v of defaultFeeding.npk) expect(v).toBeLessThanOrEqual(F.npkEach.max);
		expect(defaultFeeding.fullRationG).toBeGreaterThanOrEqual(F.fullRationG.min);
		expect(defaultFeeding.fullRationG).toBeLessThanOrEqual(F.fullRationG.max);
		expect(defaultFeeding.handfulG).toBeGreaterThanOrEqual(F.handfulG.min);
		expect(defaultFeeding.handfulG).toBeLessThanOrEqual(F.handfulG.max);
		for (const b of [F.npkEach, F.fullRationG, F.handfulG, F.nitrogenCapKgPer100m2]) expect(b.source).toMatch(SOURCE);
	});

	it('the engine feeds with the extremes of the scoop, analysis and cap', () => {
		const F = FEEDING_SETTING_BOUNDS;
		for (const feeding of [
			{ ...defaultFeeding, npk: [F.npkEach.max, F.npkTotalMax - F.npkEach.max, 0] as [number, number, number], fullRationG: F.fullRationG.max, handfulG: F.handfulG.max, nitrogenCapKgPer100m2: F.nitrogenCapKgPer100m2.min },
			{ ...defaultFeeding, npk: [0, 0, F.npkEach.max] as [number, number, number], fullRationG: F.fullRationG.min, handfulG: F.handfulG.min, nitrogenCapKgPer100m2: F.nitrogenCapKgPer100m2.max }
		]) {
			const plan = computePlan({ cultivar: referenceCultivar(), plantedOn: '2026-03-15', ageAtPlantingWeeks: 12, climate: climates[0], feeding });
			const feedings = plan.steps.filter((s) => s.kind === 'feeding');
			expect(feedings.length).toBeGreaterThan(0);
			for (const s of feedings) expect(s.amount!.value).toBeGreaterThan(0);
		}
	});
});
