/** The plant API's JSON shapes, one place, so every endpoint answers alike. */
import type { StepMove } from '$lib/plants/plan-diff';
import { bunchMassGrams, bunchMassUnit } from '$lib/plants/milestones';
import type { Units } from '$lib/care';
import { stageLabel } from '$lib/plan-text';
import { isPlantStage } from '$lib/care';
import type { PlanStepRow } from '../plans/repository';
import type { MilestoneRow, PlantRow } from './plant-repository';

export const photoUrls = (photoId: number) => ({ thumbnail: `/uploads/${photoId}/thumbnail`, display: `/uploads/${photoId}/display` });

export function plantJson(p: { plant: PlantRow; cultivarName: string; cultivarSlug: string; climateSlug: string | null }) {
	const { plant } = p;
	return {
		id: plant.id,
		cultivar: { slug: p.cultivarSlug, name: p.cultivarName },
		plantedOn: plant.plantedOn,
		ageAtPlantingWeeks: plant.ageAtPlantingWeeks,
		climate: p.climateSlug ?? (plant.customMonthlyMeanC ? { monthlyMeanC: plant.customMonthlyMeanC } : null),
		units: plant.units,
		archived: plant.archivedAt !== null,
		stage: plant.stage && isPlantStage(plant.stage) ? { id: plant.stage, label: stageLabel(plant.stage) } : null,
		nextStep: plant.nextStepOn ? { on: plant.nextStepOn, kind: plant.nextStepKind } : null,
		lastMilestone: plant.lastMilestoneOn ? { on: plant.lastMilestoneOn, kind: plant.lastMilestoneKind } : null,
		parentPlantId: plant.parentPlantId,
		planChangedAt: plant.planChangedAt?.toISOString() ?? null
	};
}

export function milestoneJson(m: MilestoneRow, units: Units) {
	return {
		id: m.id,
		kind: m.kind,
		generation: m.generation,
		on: m.on,
		...(m.leaves !== null ? { leaves: m.leaves } : {}),
		...(m.hands !== null ? { hands: m.hands } : {}),
		...(m.bunchMassG !== null
			? { bunchMass: Math.round((m.bunchMassG / bunchMassGrams(1, units)) * 10) / 10, bunchMassUnit: bunchMassUnit(units) }
			: {}),
		...(m.lossReason !== null ? { reason: m.lossReason } : {}),
		note: m.note,
		photo: m.photoId ? photoUrls(m.photoId) : null,
		dividedPlantId: m.dividedPlantId
	};
}

export function stepJson(s: PlanStepRow) {
	return {
		uid: s.uid,
		sequence: s.sequence,
		generation: s.generation,
		kind: s.kind,
		occurrence: s.occurrence,
		title: s.title,
		detail: s.detail,
		earliest: s.earliest,
		likely: s.likely,
		latest: s.latest,
		...(s.amount ? { amount: s.amount } : {}),
		...(s.nutrients ? { nutrients: s.nutrients } : {}),
		...(s.cautions ? { cautions: s.cautions } : {}),
		...(s.guide ? { guide: s.guide } : {}),
		observed: s.observed,
		restricted: s.restricted,
		changedAt: s.changedAt.toISOString()
	};
}

export const moveJson = (m: StepMove) => ({ uid: m.uid, generation: m.generation, kind: m.kind, occurrence: m.occurrence, from: m.fromLikely, to: m.toLikely, days: m.days });

/** A positive integer route parameter, or undefined (the route then answers 404). */
export function idParam(value: string): number | undefined {
	return /^[1-9]\d{0,9}$/.test(value) && Number(value) <= 2_147_483_647 ? Number(value) : undefined;
}
