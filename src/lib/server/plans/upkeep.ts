/**
 * Upkeep of stored plans, run by the worker: plans written by an older engine are regenerated,
 * and stale plant summaries are refreshed.
 *
 * The plant row's stage and next step, which the nursery's table sorts and filters by, are worked
 * out when a plan is regenerated; days later they are behind once the next step's day has passed.
 * The worker refreshes every such plant from its stored steps and milestones (no plan is
 * recomputed, nothing a gardener sees moves), a batch at a time. Safe to run in several workers at
 * once: each plant is refreshed under its row lock and the result depends only on the stored rows.
 */
import { planSummary } from '$lib/plants/summary';
import { db } from '../db';
import type { Tx } from '../db/tx';
import { nurseryService } from '../nursery/service';
import { repeatEvery } from '../periodic';
import { todayIso } from '../plan-preview';
import { plansRepository } from './repository';
import { engineFingerprint } from './engine';
import { regeneratePlan } from './regenerate';

export interface SummaryRefreshDeps {
	repo: Pick<typeof plansRepository, 'staleSummaryIds' | 'lockPlant' | 'steps' | 'milestonesForPlan' | 'updateSummary'>;
	/** Runs one plant's refresh in a transaction of its own. */
	transaction: <T>(work: (tx: Tx) => Promise<T>) => Promise<T>;
	/** The pool, for the read that picks the next batch. */
	reader: Parameters<typeof plansRepository.staleSummaryIds>[0];
	timeZone: () => Promise<string>;
	now: () => Date;
}

/** Batches a run takes at most: a run always ends, and the next one carries on. */
const MAX_BATCHES = 50;

export function createSummaryRefresher(deps: SummaryRefreshDeps) {
	/** Refreshes stale plant rows; returns how many it refreshed. */
	return async function refreshStaleSummaries(batchSize = 200): Promise<number> {
		const today = todayIso(deps.now(), await deps.timeZone());
		let refreshed = 0;
		for (let batch = 0; batch < MAX_BATCHES; batch++) {
			const ids = await deps.repo.staleSummaryIds(deps.reader, today, batchSize);
			for (const id of ids) {
				await deps.transaction(async (tx) => {
					if (!(await deps.repo.lockPlant(tx, id))) return;
					const [steps, logged] = await Promise.all([deps.repo.steps(tx, id), deps.repo.milestonesForPlan(tx, id)]);
					await deps.repo.updateSummary(tx, id, planSummary(steps, logged, today), undefined);
				});
			}
			refreshed += ids.length;
			if (ids.length < batchSize) break;
		}
		return refreshed;
	};
}

export const refreshStaleSummaries = createSummaryRefresher({
	repo: plansRepository,
	transaction: (work) => db.transaction(work),
	reader: db,
	timeZone: async () => (await nurseryService.planningContext()).timeZone,
	now: () => new Date()
});

export interface OutdatedPlanDeps {
	outdatedPlanIds: (engine: string, afterId: number, limit: number) => Promise<number[]>;
	/** Regenerates one plant's plan in a transaction of its own. */
	regenerate: (plantId: number) => Promise<void>;
	engine: () => string;
	log: (line: string) => void;
}

/**
 * Regenerates, a batch at a time, planted plants whose stored plan another engine wrote. A plant
 * the engine now refuses (its climate was removed, say) is logged and left for the next run; the
 * cursor moves past it, so a run always ends.
 */
export function createOutdatedPlanRegenerator(deps: OutdatedPlanDeps) {
	return async function regenerateOutdatedPlans(batchSize = 100): Promise<number> {
		const engine = deps.engine();
		let regenerated = 0;
		let afterId = 0;
		for (let batch = 0; batch < MAX_BATCHES; batch++) {
			const ids = await deps.outdatedPlanIds(engine, afterId, batchSize);
			for (const id of ids) {
				try {
					await deps.regenerate(id);
					regenerated++;
				} catch (e) {
					deps.log(`[plants] plant ${id}: the plan could not be regenerated (${(e as Error).message})`);
				}
			}
			if (ids.length < batchSize) break;
			afterId = ids.at(-1)!;
		}
		return regenerated;
	};
}

export const regenerateOutdatedPlans = createOutdatedPlanRegenerator({
	outdatedPlanIds: (engine, afterId, limit) => plansRepository.outdatedPlanIds(db, engine, afterId, limit),
	regenerate: async (plantId) => void (await db.transaction((tx) => regeneratePlan(tx, plantId, { kind: 'engine' }))),
	engine: engineFingerprint,
	log: (line) => console.error(line)
});

/** Often enough that a recalibration reaches every plan within hours, and a stage changes on a day. */
const UPKEEP_EVERY_MS = 10 * 60_000;

/** Runs the upkeep now and then every ten minutes in this worker; returns its stop. */
export function startPlanUpkeep(log: (line: string) => void = (l) => console.log(l)): () => Promise<void> {
	return repeatEvery(
		UPKEEP_EVERY_MS,
		async () => {
			const regenerated = await regenerateOutdatedPlans();
			if (regenerated) log(`[plants] regenerated ${regenerated} plan(s) written by an earlier care model`);
			const refreshed = await refreshStaleSummaries();
			if (refreshed) log(`[plants] refreshed the stage and next step of ${refreshed} plant(s)`);
		},
		'[plants] plan upkeep failed'
	);
}
