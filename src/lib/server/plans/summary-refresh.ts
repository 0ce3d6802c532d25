/**
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
import { todayIso } from '../plan-preview';
import { plansRepository } from './repository';

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

/** An hour is plenty: a stage changes on a day, and the table shows days. */
const REFRESH_EVERY_MS = 60 * 60_000;

/** Runs the refresh now and then every hour in this worker; returns its stop. */
export function startSummaryRefresh(log: (line: string) => void = (l) => console.log(l)): () => Promise<void> {
	let running: Promise<void> | null = null;
	const run = () => {
		running ??= refreshStaleSummaries()
			.then((n) => void (n && log(`[plants] refreshed the stage and next step of ${n} plant(s)`)))
			// The database may be restarting: the next run tries again.
			.catch((e: Error) => console.error('[plants] summary refresh failed:', e.message))
			.finally(() => (running = null));
	};
	const timer = setInterval(run, REFRESH_EVERY_MS);
	run();
	return async () => {
		clearInterval(timer);
		await running;
	};
}
