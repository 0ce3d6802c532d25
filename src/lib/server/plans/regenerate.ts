/**
 * Stored plans: the one way a plant's plan is (re)written. Call `regeneratePlan(tx, plantId, cause)`
 * inside the transaction that changed an input of the plan (claim, planting date, climate, units,
 * a milestone, the cultivar's figures, the nursery's feeding settings). It computes the engine's
 * plan from the plant's inputs, matches it against the stored steps by identity (generation, kind,
 * occurrence), keeps every uid that still exists, raises the sequence of steps that changed,
 * records what moved and why, and keeps the plant row's stage / next step / last milestone current.
 * Pages, feeds, reminders and the nursery's table read the stored steps; nothing recomputes a plan
 * on a page view.
 */
import { randomUUID } from 'node:crypto';
import { computePlan, type FeedingSettings, type PlanInput } from '$lib/care';
import { diffPlan, type PlanDiff, type StepMove } from '$lib/plants/plan-diff';
import { observedInputs } from '$lib/plants/milestones';
import { planSummary, type PlantSummary } from '$lib/plants/summary';
import type { ChangeCause } from '$lib/plants/changes';
import { catalogueService } from '../catalogue/service';
import { nurseryService } from '../nursery/service';
import { todayIso } from '../plan-preview';
import { UserFacingError } from '../errors';
import type { Tx } from '../db/tx';
import { engineFingerprint } from './engine';
import { plansRepository, type PlantRow } from './repository';
import { reminderService } from '../reminders/service';

export interface RegenerationDeps {
	repo: typeof plansRepository;
	cultivarById: (id: number) => Promise<{ cultivar: PlanInput['cultivar'] } | undefined>;
	climateById: (id: number) => Promise<{ climate: { monthlyMeanC: number[] } } | undefined>;
	planningContext: () => Promise<{ feeding: FeedingSettings; timeZone: string }>;
	now: () => Date;
	/** The fingerprint of the engine that computes the plan, stamped on the plant row (engine.ts). */
	engine?: () => string;
	/** Runs in the same transaction once the steps are written: reminders follow the new plan. */
	afterChange?: (tx: Tx, plantId: number) => Promise<void>;
}

export interface Regeneration {
	/** Steps whose likely day moved, with the days each moved (positive: later). */
	moved: StepMove[];
	added: number;
	removed: number;
	changed: number;
	summary: PlantSummary;
}

/** Why a plant has no plan yet: it has not been claimed and planted. */
const plannable = (p: PlantRow) => p.plantedOn !== null && p.ageAtPlantingWeeks !== null && (p.climateProfileId !== null || p.customMonthlyMeanC !== null);

async function monthlyMeansOf(deps: RegenerationDeps, plant: PlantRow): Promise<number[]> {
	if (plant.climateProfileId !== null) {
		const profile = await deps.climateById(plant.climateProfileId);
		if (!profile) throw new UserFacingError('climate', 'The garden climate no longer exists: choose another', 409);
		return profile.climate.monthlyMeanC;
	}
	return plant.customMonthlyMeanC!;
}

export function createPlanRegenerator(deps: RegenerationDeps) {
	return async function regeneratePlan(tx: Tx, plantId: number, cause: ChangeCause): Promise<Regeneration | null> {
		const plant = await deps.repo.lockPlant(tx, plantId);
		if (!plant) throw new UserFacingError('plant', 'No such plant', 404);
		if (!plannable(plant)) return null;
		const stored = await deps.cultivarById(plant.cultivarId);
		if (!stored) throw new UserFacingError('cultivar', 'The cultivar no longer exists', 409);
		const [monthlyMeanC, context, logged, steps] = [
			await monthlyMeansOf(deps, plant),
			await deps.planningContext(),
			await deps.repo.milestonesForPlan(tx, plantId),
			await deps.repo.steps(tx, plantId)
		];
		const { observed, observedFollowers } = observedInputs(logged);
		let plan;
		try {
			plan = computePlan({
				cultivar: stored.cultivar,
				plantedOn: plant.plantedOn!,
				ageAtPlantingWeeks: plant.ageAtPlantingWeeks!,
				climate: { monthlyMeanC },
				units: plant.units ?? 'metric',
				feeding: context.feeding,
				observed,
				observedFollowers
			});
		} catch (e) {
			// The engine refuses inputs it cannot plan from (a milestone before planting, a climate too cool to fruit).
			if (e instanceof RangeError) throw new UserFacingError(cause.kind === 'climate' ? 'climate' : 'on', e.message);
			throw e;
		}
		const now = deps.now();
		const diff: PlanDiff = diffPlan(steps, plan.steps);
		await deps.repo.deleteSteps(
			tx,
			plantId,
			diff.removed.map((s) => s.uid)
		);
		await deps.repo.upsertSteps(
			tx,
			plantId,
			[...diff.changed.map((c) => ({ ...c.content, uid: c.uid, sequence: c.sequence })), ...diff.added.map((a) => ({ ...a, uid: randomUUID(), sequence: 0 }))],
			now
		);
		await deps.repo.insertChanges(
			tx,
			diff.moved.map((m) => ({ plantId, changedAt: now, stepUid: m.uid, generation: m.generation, kind: m.kind, occurrence: m.occurrence, fromLikely: m.fromLikely, toLikely: m.toLikely, days: m.days, cause }))
		);
		const anything = diff.changed.length + diff.added.length + diff.removed.length > 0;
		const summary = planSummary(plan.steps, logged, todayIso(now, context.timeZone));
		await deps.repo.updateSummary(tx, plantId, summary, anything ? now : undefined, deps.engine?.());
		await deps.afterChange?.(tx, plantId);
		return { moved: diff.moved, added: diff.added.length, removed: diff.removed.length, changed: diff.changed.length, summary };
	};
}

/**
 * Regenerates one plant's stored plan inside the caller's transaction. Returns null for a plant
 * that has no plan yet (not claimed and planted). Throws UserFacingError for inputs the engine refuses.
 */
export const regeneratePlan = createPlanRegenerator({
	repo: plansRepository,
	cultivarById: catalogueService.cultivarById,
	climateById: catalogueService.climateById,
	planningContext: nurseryService.planningContext,
	now: () => new Date(),
	engine: engineFingerprint,
	// Unsent reminders move with their steps; a sent one is never sent again (src/lib/reminders/schedule.ts).
	afterChange: (tx, plantId) => reminderService.syncPlant(tx, plantId)
});
