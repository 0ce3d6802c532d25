/**
 * What the plant row keeps of its stored plan for the nursery's table: the stage of the stem that
 * carries the mat, the next step due and the last milestone. Worked out once per regeneration.
 */
import { STAGE_OF_STEP, type IsoDate, type PlantStage, type StepKind } from '$lib/care';
import type { LoggedMilestone } from './milestones';
import { currentGeneration } from './milestones';

interface DatedStep {
	kind: string;
	generation: number;
	likely: IsoDate;
	observed?: boolean;
}

export interface PlantSummary {
	stage: PlantStage;
	nextStepOn: IsoDate | null;
	nextStepKind: string | null;
	lastMilestoneOn: IsoDate | null;
	lastMilestoneKind: string | null;
}

/** Feedings belong to the whole mat, whichever stem carries it. */
const belongsTo = (s: DatedStep, generation: number) => s.kind === 'feeding' || s.generation >= generation;

/** Steps sorted by likely day; ties keep the plan's order. */
export function planSummary(steps: readonly DatedStep[], milestones: readonly LoggedMilestone[], today: IsoDate): PlantSummary {
	const generation = currentGeneration(milestones);
	const live = steps.filter((s) => belongsTo(s, generation));
	const started = live.filter((s) => s.likely <= today && (s.kind === 'feeding' || s.kind === 'planting' || s.generation === generation));
	const current = started.at(-1);
	const next = live.find((s) => s.likely >= today && !s.observed);
	const last = [...milestones].sort((a, b) => (a.on < b.on ? -1 : a.on > b.on ? 1 : a.id - b.id)).at(-1);
	return {
		// A feeding is work on the whole mat, begun once the plant grows leaves; before anything has begun it is just planted.
		stage: !current ? 'planted' : current.kind === 'feeding' ? 'growing-leaves' : STAGE_OF_STEP[current.kind as Exclude<StepKind, 'feeding'>],
		nextStepOn: next?.likely ?? null,
		nextStepKind: next?.kind ?? null,
		lastMilestoneOn: last?.on ?? null,
		lastMilestoneKind: last?.kind ?? null
	};
}
