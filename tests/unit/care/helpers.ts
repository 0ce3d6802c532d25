import type { Plan, PlanInput, Step, StepKind } from '../../../src/lib/care/types';
import { findClimate, findCultivar } from '../../../src/lib/care/catalogue';

export const MEAN_MONTH_DAYS = 365.2425 / 12;

export function days(from: string, to: string): number {
	return (Date.parse(to) - Date.parse(from)) / 86_400_000;
}

export function months(from: string, to: string): number {
	return days(from, to) / MEAN_MONTH_DAYS;
}

export function only(plan: Plan, kind: StepKind, generation = 0): Step {
	const found = plan.steps.filter((s) => s.kind === kind && s.generation === generation);
	if (found.length !== 1) throw new Error(`expected one ${kind} step for generation ${generation}, got ${found.length}`);
	return found[0];
}

export function input(overrides: Partial<PlanInput> & { cultivarSlug?: string; climateSlug?: string } = {}): PlanInput {
	const { cultivarSlug = 'grand-nain', climateSlug = 'south-florida-coast', ...rest } = overrides;
	return {
		cultivar: findCultivar(cultivarSlug)!,
		climate: findClimate(climateSlug)!,
		plantedOn: '2025-03-15',
		ageAtPlantingWeeks: 0,
		...rest
	};
}
