import { describe, expect, it } from 'vitest';
import { computePlan, findClimate, findCultivar, type Plan } from '../../../src/lib/care';
import { plantStatus, statusFromPlan } from '../../../src/lib/server/plants/status';

const step = (kind: string, likely: string, generation = 0, earliest = likely) =>
	({ kind, title: kind, detail: '', earliest, likely, latest: likely, generation }) as Plan['steps'][number];

const plan: Plan = {
	steps: [
		step('planting', '2026-03-01'),
		step('feeding', '2026-04-01'),
		step('followers', '2026-07-01'),
		step('flag-leaf', '2026-11-01'),
		step('harvest', '2027-03-15', 0, '2027-03-01'),
		step('cut-back', '2027-03-20')
	]
};

describe('a plant’s stage and next step', () => {
	it('is nothing before planting, with planting as the next step', () => {
		expect(statusFromPlan(plan, '2026-02-20')).toMatchObject({ stage: null, nextStep: { kind: 'planting', on: '2026-03-01' } });
	});
	it('follows the last stage reached and the first step still ahead', () => {
		expect(statusFromPlan(plan, '2026-03-05')).toMatchObject({ stage: { id: 'planted' }, nextStep: { kind: 'feeding' } });
		expect(statusFromPlan(plan, '2026-08-01')).toMatchObject({ stage: { id: 'followers-out' }, nextStep: { kind: 'flag-leaf' } });
		// Ready from the opening of the harvest window, before its likely day.
		expect(statusFromPlan(plan, '2027-03-02')).toMatchObject({ stage: { id: 'ready' }, nextStep: { kind: 'harvest', on: '2027-03-15' } });
		expect(statusFromPlan(plan, '2027-04-01')).toMatchObject({ stage: { id: 'cut-back' }, nextStep: null });
	});
	it('an unclaimed plant has neither', () => {
		expect(plantStatus({ cultivar: findCultivar('grand-nain')!, plantedOn: null, ageAtPlantingWeeks: null, monthlyMeanC: null, units: 'metric' }, undefined as never, '2026-01-01')).toEqual({ stage: null, nextStep: null });
	});
	it('reads the engine’s plan for a claimed plant', () => {
		const input = { cultivar: findCultivar('grand-nain')!, plantedOn: '2026-03-01', ageAtPlantingWeeks: 12, monthlyMeanC: findClimate('south-florida-coast')!.monthlyMeanC, units: 'metric' as const };
		const engine = computePlan({ ...input, climate: { monthlyMeanC: input.monthlyMeanC } });
		const firstFeeding = engine.steps.find((s) => s.kind === 'feeding')!;
		expect(plantStatus(input, undefined as never, '2026-03-02').nextStep).toMatchObject({ kind: 'feeding', on: firstFeeding.likely });
	});
});
