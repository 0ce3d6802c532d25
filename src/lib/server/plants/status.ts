/**
 * Where a plant is today and what comes next: the one place that answers it for the plant lists
 * and the API. Today it reads the plan the engine computes from the plant's inputs; stored plans
 * (plan_steps) can replace the computation here without any caller changing.
 */
import { computePlan, stageLabel, stageOn, type Cultivar, type FeedingSettings, type IsoDate, type Plan, type StepKind } from '../../care';

export interface PlantInputs {
	cultivar: Cultivar;
	plantedOn: IsoDate | null;
	ageAtPlantingWeeks: number | null;
	monthlyMeanC: number[] | null;
	units: 'metric' | 'imperial';
}

export interface PlantStatus {
	/** Plain words for where the plant is; null when it is not planted (or not claimed) yet. */
	stage: { id: string; label: string } | null;
	/** The first step whose likely day is today or later. */
	nextStep: { kind: StepKind; title: string; on: IsoDate; generation: number } | null;
}

/** The plant as sold: its stage in the engine's words (`stageOn`), and its next step. */
export function statusFromPlan(plan: Plan, today: IsoDate): PlantStatus {
	const id = stageOn(plan, today);
	const stage: PlantStatus['stage'] = id === null ? null : { id, label: stageLabel(id) };
	const next = plan.steps.find((s) => s.likely >= today);
	return { stage, nextStep: next ? { kind: next.kind, title: next.title, on: next.likely, generation: next.generation } : null };
}

export function plantStatus(plant: PlantInputs, feeding: FeedingSettings, today: IsoDate): PlantStatus {
	if (!plant.plantedOn || plant.ageAtPlantingWeeks === null || !plant.monthlyMeanC) return { stage: null, nextStep: null };
	const plan = computePlan({
		cultivar: plant.cultivar,
		plantedOn: plant.plantedOn,
		ageAtPlantingWeeks: plant.ageAtPlantingWeeks,
		climate: { monthlyMeanC: plant.monthlyMeanC },
		units: plant.units,
		feeding
	});
	return statusFromPlan(plan, today);
}
