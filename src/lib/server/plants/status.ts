/**
 * Where a plant is today and what comes next: the one place that answers it for the plant lists
 * and the API. Today it reads the plan the engine computes from the plant's inputs; stored plans
 * (plan_steps) can replace the computation here without any caller changing.
 */
import { computePlan, type Cultivar, type FeedingSettings, type IsoDate, type Plan, type Step, type StepKind } from '../../care';

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

/** Stage of the plant as sold, from the last kind of step it has passed (most recent wins). */
const STAGE_AFTER: readonly [StepKind, string, string][] = [
	['planting', 'planted', 'Just planted'],
	['feeding', 'growing-leaves', 'Growing leaves'],
	['followers', 'followers-out', 'Followers out'],
	['flag-leaf', 'flowering', 'Flowering and bunch filling'],
	['harvest', 'ready', 'Ready to harvest'],
	['cut-back', 'cut-back', 'Cut back'],
	['stem-removal', 'handed-on', 'Handed on to its follower']
];

export function statusFromPlan(plan: Plan, today: IsoDate): PlantStatus {
	const own = plan.steps.filter((s) => s.generation === 0);
	const firstOf = (kind: StepKind): Step | undefined => (kind === 'feeding' ? plan.steps : own).find((s) => s.kind === kind);
	let stage: PlantStatus['stage'] = null;
	for (const [kind, id, label] of STAGE_AFTER) {
		const s = firstOf(kind);
		const start = kind === 'harvest' ? s?.earliest : s?.likely;
		if (start !== undefined && start <= today) stage = { id, label };
	}
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
