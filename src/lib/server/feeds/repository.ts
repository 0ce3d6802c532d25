import { and, asc, desc, eq, isNull, sql } from 'drizzle-orm';
import { db } from '../db';
import { calendarFeeds, cultivars, planSteps, plants } from '../db/schema';

/** The plants a feed shows: its one plant while the gardener still has it, or all their current plants. */
const feedPlants = (feed: { userId: number; plantId: number | null }) =>
	feed.plantId === null
		? and(eq(plants.gardenerId, feed.userId), isNull(plants.archivedAt))
		: and(eq(plants.id, feed.plantId), eq(plants.gardenerId, feed.userId));

export interface FeedLookup {
	id: number;
	userId: number;
	plantId: number | null;
	etag: string | null;
	lastModified: Date | null;
	renderedVersion: string | null;
	/** The plan state now: which plants, and when each plan last changed. Null: the feed's one plant is no longer the gardener's. */
	version: string | null;
}

export const feedRepository = {
	async plantOwnedBy(plantId: number, userId: number): Promise<boolean> {
		const rows = await db.select({ id: plants.id }).from(plants).where(and(eq(plants.id, plantId), eq(plants.gardenerId, userId)));
		return rows.length === 1;
	},

	/** The gardener's current plants, for choosing a feed's scope. */
	plantsOf: (userId: number) =>
		db
			.select({ id: plants.id, cultivar: cultivars.name, plantedOn: plants.plantedOn })
			.from(plants)
			.innerJoin(cultivars, eq(cultivars.id, plants.cultivarId))
			.where(and(eq(plants.gardenerId, userId), isNull(plants.archivedAt)))
			.orderBy(asc(plants.id)),

	async insert(values: { userId: number; plantId: number | null; tokenHash: string }): Promise<number> {
		const [row] = await db.insert(calendarFeeds).values(values).returning({ id: calendarFeeds.id });
		return row.id;
	},

	list: (userId: number) =>
		db
			.select({
				id: calendarFeeds.id,
				plantId: calendarFeeds.plantId,
				cultivar: cultivars.name,
				createdAt: calendarFeeds.createdAt,
				lastModified: calendarFeeds.lastModified
			})
			.from(calendarFeeds)
			.leftJoin(plants, eq(plants.id, calendarFeeds.plantId))
			.leftJoin(cultivars, eq(cultivars.id, plants.cultivarId))
			.where(and(eq(calendarFeeds.userId, userId), isNull(calendarFeeds.revokedAt)))
			.orderBy(desc(calendarFeeds.createdAt), desc(calendarFeeds.id)),

	async byId(id: number, userId: number) {
		const [row] = await db
			.select({ id: calendarFeeds.id, plantId: calendarFeeds.plantId })
			.from(calendarFeeds)
			.where(and(eq(calendarFeeds.id, id), eq(calendarFeeds.userId, userId), isNull(calendarFeeds.revokedAt)));
		return row;
	},

	async revoke(id: number, userId: number, now: Date): Promise<boolean> {
		const rows = await db
			.update(calendarFeeds)
			.set({ revokedAt: now, ics: null })
			.where(and(eq(calendarFeeds.id, id), eq(calendarFeeds.userId, userId), isNull(calendarFeeds.revokedAt)))
			.returning({ id: calendarFeeds.id });
		return rows.length === 1;
	},

	/** Revokes one feed and issues its successor with the same scope, in one transaction. */
	async rotate(id: number, userId: number, tokenHash: string, now: Date): Promise<number | null> {
		return db.transaction(async (tx) => {
			const [old] = await tx
				.update(calendarFeeds)
				.set({ revokedAt: now, ics: null })
				.where(and(eq(calendarFeeds.id, id), eq(calendarFeeds.userId, userId), isNull(calendarFeeds.revokedAt)))
				.returning({ plantId: calendarFeeds.plantId });
			if (!old) return null;
			const [row] = await tx.insert(calendarFeeds).values({ userId, plantId: old.plantId, tokenHash }).returning({ id: calendarFeeds.id });
			return row.id;
		});
	},

	/** One query on every calendar poll: the live feed with that token and its plan version now. */
	async lookup(tokenHash: string): Promise<FeedLookup | undefined> {
		const rows = await db.execute<{
			id: number;
			user_id: number;
			plant_id: number | null;
			etag: string | null;
			last_modified: string | null;
			rendered_version: string | null;
			version: string | null;
		}>(sql`
			select f.id, f.user_id, f.plant_id, f.etag, f.last_modified, f.rendered_version,
				coalesce(
					(select md5(string_agg(p.id || '@' || coalesce(p.plan_changed_at::text, '-'), ',' order by p.id))
					   from plants p
					  where p.gardener_id = f.user_id
					    and (case when f.plant_id is null then p.archived_at is null else p.id = f.plant_id end)),
					-- An all-plants feed of someone with no plants yet is an empty calendar, not a missing one.
					case when f.plant_id is null then 'no plants' end) as version
			  from calendar_feeds f
			 where f.token_hash = ${tokenHash} and f.revoked_at is null`);
		const r = rows[0];
		if (!r) return undefined;
		return {
			id: r.id,
			userId: r.user_id,
			plantId: r.plant_id,
			etag: r.etag,
			lastModified: r.last_modified ? new Date(r.last_modified) : null,
			renderedVersion: r.rendered_version,
			version: r.version
		};
	},

	async storedIcs(id: number): Promise<string | null> {
		const [row] = await db.select({ ics: calendarFeeds.ics }).from(calendarFeeds).where(eq(calendarFeeds.id, id));
		return row?.ics ?? null;
	},

	steps: (feed: { userId: number; plantId: number | null }) =>
		db
			.select({
				uid: planSteps.uid,
				sequence: planSteps.sequence,
				changedAt: planSteps.changedAt,
				plantId: planSteps.plantId,
				title: planSteps.title,
				detail: planSteps.detail,
				earliest: planSteps.earliest,
				likely: planSteps.likely,
				latest: planSteps.latest,
				generation: planSteps.generation,
				amount: planSteps.amount,
				nutrients: planSteps.nutrients,
				cautions: planSteps.cautions,
				guide: planSteps.guide,
				restricted: planSteps.restricted,
				cultivar: cultivars.name
			})
			.from(planSteps)
			.innerJoin(plants, eq(plants.id, planSteps.plantId))
			.innerJoin(cultivars, eq(cultivars.id, plants.cultivarId))
			.where(feedPlants(feed))
			.orderBy(asc(planSteps.likely), asc(planSteps.id)),

	async storeRendered(id: number, values: { ics: string; etag: string; lastModified: Date; renderedVersion: string }): Promise<void> {
		await db.update(calendarFeeds).set(values).where(eq(calendarFeeds.id, id));
	},

	/** After a plan changes: the plant's feeds and its gardener's all-plants feeds render again on their next fetch. */
	async invalidateForPlant(plantId: number, executor: Pick<typeof db, 'execute'> = db): Promise<void> {
		await executor.execute(sql`
			update calendar_feeds set rendered_version = null
			 where revoked_at is null
			   and (plant_id = ${plantId} or (plant_id is null and user_id = (select gardener_id from plants where id = ${plantId})))`);
	}
};

export type FeedRepository = typeof feedRepository;
