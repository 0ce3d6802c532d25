import { describe, expect, it } from 'vitest';
import { referenceClimateSlug, referenceCultivarSlug } from '$lib/care';
import { plannerView } from '$lib/server/plan-preview';
import { builtInSnapshot } from '$lib/server/catalogue/snapshot';
import { parsePlanQuery, planQueryString } from '$lib/schema/plan';

const TODAY = '2026-05-04';
const catalogue = builtInSnapshot();

describe('year planner page data', () => {
	it('with no query shows an example plan: the reference cultivar and climate, today, 12 weeks', () => {
		const view = plannerView(new URLSearchParams(), catalogue, TODAY);
		expect(view.example).toBe(true);
		expect(view.errors).toEqual({});
		expect(view.values).toMatchObject({ cultivar: referenceCultivarSlug, plantedOn: TODAY, ageAtPlantingWeeks: '12', climate: referenceClimateSlug });
		expect(view.result?.plan.steps[0]).toMatchObject({ kind: 'planting', likely: TODAY });
	});

	it('keeps refused values and keys errors by query field, month by month', () => {
		const params = new URLSearchParams('cultivar=grand-nain&plantedOn=2026-02-30&ageAtPlantingWeeks=1.5&climate=custom');
		for (const v of ['20', '21', 'warm', '', '', '', '', '', '', '', '', '']) params.append('monthlyMeanC', v);
		const view = plannerView(params, catalogue, TODAY);
		expect(view.result).toBeNull();
		expect(Object.keys(view.errors)).toEqual(expect.arrayContaining(['plantedOn', 'ageAtPlantingWeeks', 'monthlyMeanC.2', 'monthlyMeanC.3']));
		expect(view.values).toMatchObject({ plantedOn: '2026-02-30', ageAtPlantingWeeks: '1.5', climate: 'custom' });
		expect(view.values.monthlyMeanC.slice(0, 3)).toEqual(['20', '21', 'warm']);
	});

	it('a catalogue climate wins over the twelve inputs the form always sends', () => {
		const params = new URLSearchParams(`cultivar=grand-nain&plantedOn=2026-03-01&ageAtPlantingWeeks=12&climate=${referenceClimateSlug}`);
		for (let i = 0; i < 12; i++) params.append('monthlyMeanC', '');
		const view = plannerView(params, catalogue, TODAY);
		expect(view.errors).toEqual({});
		expect(view.result?.query).toBe(`cultivar=grand-nain&plantedOn=2026-03-01&ageAtPlantingWeeks=12&climate=${referenceClimateSlug}`);
	});

	it('the canonical query parses back to the same request', () => {
		const request = { cultivar: 'saba', plantedOn: '2026-03-01', ageAtPlantingWeeks: 0, climate: { monthlyMeanC: [25, 25, 25, 25, 25, 25, 25, 25, 25, 25, 25, 25.5] }, units: 'imperial' as const, observed: { shotOn: '2026-12-01' } };
		const parsed = parsePlanQuery(new URLSearchParams(planQueryString(request)));
		expect(parsed.success && parsed.data).toEqual(request);
	});
});
