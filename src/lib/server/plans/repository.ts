/** Queries of the stored plans: plan steps, the plant row's plan columns, what moved. Queries only. */
import { and, asc, desc, eq, gt, inArray, isNotNull, isNull, lt, ne, or, sql } from 'drizzle-orm';
import { milestones, planChanges, planSteps, plants } from '../db/schema';
import type { Conn } from '../db/tx';
import type { StepContent } from '../../plants/plan-diff';
import type { PlantSummary } from '../../plants/summary';

export type PlantRow = typeof plants.$inferSelect;
export type PlanStepRow = typeof planSteps.$inferSelect;
export type PlanChangeRow = typeof planChanges.$inferSelect;

export const plansRepository = {
	/** The plant row, locked until the transaction ends so two regenerations of one plant queue up. */
	lockPlant: async (c: Conn, plantId: number) => (await c.select().from(plants).where(eq(plants.id, plantId)).for('update'))[0],

	/** Plants whose stored next step lies before `today`: their stage and next step are behind. */
	staleSummaryIds: async (c: Conn, today: string, limit: number) =>
		(await c.select({ id: plants.id }).from(plants).where(lt(plants.nextStepOn, today)).orderBy(asc(plants.nextStepOn), asc(plants.id)).limit(limit)).map((r) => r.id),

	steps: (c: Conn, plantId: number) =>
		c.select().from(planSteps).where(eq(planSteps.plantId, plantId)).orderBy(asc(planSteps.likely), asc(planSteps.id)),

	milestonesForPlan: (c: Conn, plantId: number) =>
		c
			.select({ id: milestones.id, kind: milestones.kind, generation: milestones.generation, on: milestones.on, leaves: milestones.leaves })
			.from(milestones)
			.where(eq(milestones.plantId, plantId)),

	/**
	 * Writes changed and new steps in one statement: a step whose identity exists keeps its uid and
	 * takes the given sequence; a new one takes the uid given here.
	 */
	async upsertSteps(c: Conn, plantId: number, rows: (StepContent & { uid: string; sequence: number })[], now: Date) {
		if (rows.length === 0) return;
		await c
			.insert(planSteps)
			.values(rows.map((r) => ({ ...r, plantId, changedAt: now })))
			.onConflictDoUpdate({
				target: [planSteps.plantId, planSteps.generation, planSteps.kind, planSteps.occurrence],
				set: {
					title: sql`excluded.title`,
					detail: sql`excluded.detail`,
					earliest: sql`excluded.earliest`,
					likely: sql`excluded.likely`,
					latest: sql`excluded.latest`,
					amount: sql`excluded.amount`,
					nutrients: sql`excluded.nutrients`,
					cautions: sql`excluded.cautions`,
					guide: sql`excluded.guide`,
					observed: sql`excluded.observed`,
					restricted: sql`excluded.restricted`,
					sequence: sql`excluded.sequence`,
					changedAt: sql`excluded.changed_at`
				}
			});
	},

	deleteSteps: async (c: Conn, plantId: number, uids: string[]) => {
		if (uids.length > 0) await c.delete(planSteps).where(and(eq(planSteps.plantId, plantId), inArray(planSteps.uid, uids)));
	},

	insertChanges: async (c: Conn, rows: (typeof planChanges.$inferInsert)[]) => {
		if (rows.length > 0) await c.insert(planChanges).values(rows);
	},

	updateSummary: (c: Conn, plantId: number, summary: PlantSummary, planChangedAt: Date | undefined, planEngine?: string) =>
		c
			.update(plants)
			.set({ ...summary, ...(planChangedAt ? { planChangedAt } : {}), ...(planEngine ? { planEngine } : {}) })
			.where(eq(plants.id, plantId)),

	/** Planted plants after `afterId` whose stored plan another engine wrote (or none recorded which). */
	outdatedPlanIds: async (c: Conn, engine: string, afterId: number, limit: number) =>
		(
			await c
				.select({ id: plants.id })
				.from(plants)
				.where(and(gt(plants.id, afterId), isNotNull(plants.plantedOn), or(isNull(plants.planEngine), ne(plants.planEngine, engine))))
				.orderBy(asc(plants.id))
				.limit(limit)
		).map((r) => r.id),

	/** The moves of the plant's last regeneration that moved anything. */
	lastChanges: async (c: Conn, plantId: number) => {
		const last = await c
			.select({ at: planChanges.changedAt })
			.from(planChanges)
			.where(eq(planChanges.plantId, plantId))
			.orderBy(desc(planChanges.changedAt))
			.limit(1);
		if (!last[0]) return [];
		return c
			.select()
			.from(planChanges)
			.where(and(eq(planChanges.plantId, plantId), eq(planChanges.changedAt, last[0].at)))
			.orderBy(asc(planChanges.toLikely), asc(planChanges.id));
	}
};
export type PlansRepository = typeof plansRepository;
