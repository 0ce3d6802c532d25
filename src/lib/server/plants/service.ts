/**
 * "My plants": a page of one scope's plants with their stage and next step, read from each plant's
 * stored plan (plan_steps and its milestones) through `planSummary`, the same rule the nursery's
 * table keeps on the plant row; nothing is re-planned per request. Lists with filters, sorting
 * and counts over the stored stage and next step are the nursery table's (src/lib/server/plant-table).
 */
import { isPlantStage, stageLabel, type IsoDate, type StepKind } from '../../care';
import { planSummary } from '../../plants/summary';
import { groupBy } from '../../group';
import type { AnyDb } from '../secrets';
import { plantFilters, plantsRepository, type PlantListRow, type PlantScope } from './repository';

export type { PlantScope };

/** Staff and the owner see every plant; a gardener only their own. */
export const scopeFor = (user: { id: number; role: string }): PlantScope => (user.role === 'gardener' ? { kind: 'gardener', gardenerId: user.id } : { kind: 'all' });

export interface PlantsDeps {
	db: AnyDb;
}

export interface PlantStatus {
	/** Plain words for where the plant is; null when it is not planted (or not claimed) yet. */
	stage: { id: string; label: string } | null;
	/** The first step still ahead (today or later, not already logged). */
	nextStep: { kind: StepKind; title: string; on: IsoDate; generation: number } | null;
}

export interface PlantView extends PlantStatus {
	id: number;
	saleId: number | null;
	cultivar: { slug: string; name: string };
	soldOn: string;
	claimed: boolean;
	plantedOn: string | null;
	climate: string | null;
	units: 'metric' | 'imperial' | null;
	/** Only in the nursery's view (scope "all"): who claimed it. */
	gardener?: { id: number; name: string } | null;
}

type StoredStep = Awaited<ReturnType<ReturnType<typeof plantsRepository>['storedSteps']>>[number];
type StoredMilestone = Awaited<ReturnType<ReturnType<typeof plantsRepository>['milestonesOf']>>[number];

/** Stage and next step of one plant from its stored steps and milestones, as of `today`. */
export function statusFromStored(plantedOn: IsoDate | null, steps: StoredStep[], logged: StoredMilestone[], today: IsoDate): PlantStatus {
	if (!plantedOn || steps.length === 0) return { stage: null, nextStep: null };
	const summary = planSummary(steps, logged, today);
	const next = summary.nextStepOn ? steps.find((s) => s.likely === summary.nextStepOn && s.kind === summary.nextStepKind) : undefined;
	return {
		// Before the planting day there is no stage yet: the page says it is waiting to be planted.
		stage: plantedOn > today || !isPlantStage(summary.stage) ? null : { id: summary.stage, label: stageLabel(summary.stage) },
		nextStep: next ? { kind: next.kind as StepKind, title: next.title, on: next.likely, generation: next.generation } : null
	};
}

export function createPlantsService({ db }: PlantsDeps) {
	const repo = plantsRepository(db);

	async function views(rows: PlantListRow[], scope: PlantScope, today: string): Promise<PlantView[]> {
		const ids = rows.map((r) => r.id);
		const [steps, logged] = await Promise.all([repo.storedSteps(ids), repo.milestonesOf(ids)]);
		// Grouped once: a page of plants is one pass over its steps, not one pass per plant.
		const stepsOf = groupBy(steps, (s) => s.plantId);
		const loggedOf = groupBy(logged, (m) => m.plantId);
		return rows.map((r) => ({
			id: r.id,
			saleId: r.saleId,
			cultivar: { slug: r.cultivarSlug, name: r.cultivarName },
			soldOn: r.soldOn,
			claimed: r.claimedAt !== null,
			plantedOn: r.plantedOn,
			climate: r.customMonthlyMeanC ? 'own monthly means' : r.climateName,
			units: r.units,
			...statusFromStored(
				r.plantedOn,
				stepsOf.get(r.id) ?? [],
				loggedOf.get(r.id) ?? [],
				today
			),
			...(scope.kind === 'all' ? { gardener: r.gardenerId !== null ? { id: r.gardenerId, name: r.gardenerName ?? '' } : null } : {})
		}));
	}

	return {
		/**
		 * A page of plants in a scope with their status, for "My plants". The nursery's table and
		 * the API list through the plant table's service instead (filters, sort, stored stages).
		 */
		async page(scope: PlantScope, query: { page: number; size: number }, today: string) {
			const where = plantFilters(scope);
			const total = await repo.count(where);
			// A page past the end shows the last page rather than an empty list.
			const page = Math.min(query.page, Math.max(1, Math.ceil(total / query.size)));
			const rows = await repo.page(where, query.size, (page - 1) * query.size);
			return { plants: await views(rows, scope, today), total, page, size: query.size };
		}
	};
}

export type PlantsService = ReturnType<typeof createPlantsService>;
