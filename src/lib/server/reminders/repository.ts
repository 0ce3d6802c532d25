/** Queries behind reminders: preferences, the reminder table, the worker's pick/claim/mark. */
import { and, asc, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { Amount, Nutrients } from '../../care/types';
import type { ReminderChannel, ReminderMode, ReminderState } from '../../schema/delivery';
import type { ReminderChanges } from '../../reminders/schedule';
import { db } from '../db';
import { cultivars, planSteps, plants, reminderPreferences, reminders, users } from '../db/schema';
import type { Conn } from '../db/tx';

export interface PreferenceRow {
	userId: number;
	mode: ReminderMode;
	hour: number;
	timeZone: string;
	unsubscribeToken: string;
}

/** A claimed reminder with everything its message needs. */
export interface ClaimedReminder {
	id: number;
	userId: number;
	plantId: number;
	channel: ReminderChannel;
	dueAt: Date;
	messageId: string;
	attempts: number;
	email: string;
	name: string;
	cultivar: string;
	unsubscribeToken: string | null;
	step: null | {
		uid: string;
		sequence: number;
		changedAt: Date;
		title: string;
		detail: string;
		earliest: string;
		likely: string;
		latest: string;
		generation: number;
		amount: Amount | null;
		nutrients: Nutrients | null;
		cautions: string[] | null;
		guide: string | null;
		restricted: boolean;
	};
}

export interface StaffFilter {
	state?: ReminderState;
	plantId?: number;
}

const staffWhere = (f: StaffFilter): SQL | undefined =>
	and(f.state ? eq(reminders.state, f.state) : undefined, f.plantId ? eq(reminders.plantId, f.plantId) : undefined);

export const reminderRepository = {
	preferences: async (c: Conn, userId: number): Promise<PreferenceRow | undefined> =>
		(await c.select().from(reminderPreferences).where(eq(reminderPreferences.userId, userId)))[0],

	/** Creates the row with the given defaults unless it exists; returns the row either way. */
	async ensurePreferences(c: Conn, defaults: PreferenceRow): Promise<PreferenceRow> {
		await c.insert(reminderPreferences).values(defaults).onConflictDoNothing({ target: reminderPreferences.userId });
		return (await reminderRepository.preferences(c, defaults.userId))!;
	},

	async savePreferences(c: Conn, userId: number, values: { mode: ReminderMode; hour: number; timeZone: string }, now: Date) {
		await c.update(reminderPreferences).set({ ...values, updatedAt: now }).where(eq(reminderPreferences.userId, userId));
	},

	byUnsubscribeToken: async (token: string) =>
		(await db.select().from(reminderPreferences).where(eq(reminderPreferences.unsubscribeToken, token)))[0] as PreferenceRow | undefined,

	setUnits: (c: Conn, userId: number, units: 'metric' | 'imperial') => c.update(users).set({ units }).where(eq(users.id, userId)),

	/** The gardener's plants whose stored units differ from the wanted ones. */
	plantsInOtherUnits: async (c: Conn, userId: number, units: 'metric' | 'imperial') =>
		(await c.select({ id: plants.id }).from(plants).where(and(eq(plants.gardenerId, userId), sql`${plants.units} is distinct from ${units}`))).map((r) => r.id),

	setPlantUnits: (c: Conn, plantId: number, units: 'metric' | 'imperial') => c.update(plants).set({ units }).where(eq(plants.id, plantId)),

	plantsOf: async (c: Conn, userId: number) => (await c.select({ id: plants.id }).from(plants).where(eq(plants.gardenerId, userId))).map((r) => r.id),

	plant: async (c: Conn, plantId: number) =>
		(await c.select({ gardenerId: plants.gardenerId, archivedAt: plants.archivedAt }).from(plants).where(eq(plants.id, plantId)))[0],

	steps: (c: Conn, plantId: number) =>
		c
			.select({ id: planSteps.id, title: planSteps.title, earliest: planSteps.earliest, latest: planSteps.latest })
			.from(planSteps)
			.where(eq(planSteps.plantId, plantId))
			.orderBy(asc(planSteps.likely), asc(planSteps.id)),

	ofPlant: (c: Conn, plantId: number) =>
		c
			.select({ id: reminders.id, stepId: reminders.stepId, channel: reminders.channel, dueAt: reminders.dueAt, state: reminders.state, title: reminders.title })
			.from(reminders)
			.where(eq(reminders.plantId, plantId)),

	async apply(c: Conn, plantId: number, userId: number, changes: ReminderChanges, now: Date) {
		if (changes.skip.length) {
			await c.update(reminders).set({ state: 'skipped', updatedAt: now }).where(and(inArray(reminders.id, changes.skip), eq(reminders.state, 'due')));
		}
		for (const u of changes.update) {
			await c
				.update(reminders)
				.set({ dueAt: u.dueAt, channel: u.channel, title: u.title, state: 'due', retryAt: null, queuedAt: null, updatedAt: now })
				.where(and(eq(reminders.id, u.id), inArray(reminders.state, ['due', 'skipped'])));
		}
		if (changes.insert.length) {
			await c.insert(reminders).values(changes.insert.map((w) => ({ ...w, plantId, userId }))).onConflictDoNothing();
		}
	},

	/**
	 * Marks due reminders (and ones whose worker vanished mid-send) as queued and returns them;
	 * SKIP LOCKED lets several workers' ticks run at once without picking the same rows.
	 */
	pickDue: (limit: number, leaseMs: number) =>
		db.execute<{ id: number; user_id: number; channel: ReminderChannel; due_at: string }>(sql`
			with picked as (
				select id from reminders
				 where state in ('due', 'sending') and due_at <= now()
				   and ((state = 'due' and (retry_at is null or retry_at <= now()))
				     or (state = 'sending' and claimed_at < now() - make_interval(secs => ${leaseMs / 1000})))
				   and (queued_at is null or queued_at < now() - make_interval(secs => ${leaseMs / 1000}))
				 order by due_at, id
				 limit ${limit}
				 for update skip locked)
			update reminders r set queued_at = now() from picked where r.id = picked.id
			returning r.id, r.user_id, r.channel, r.due_at`),

	/**
	 * Claims reminders for sending (due → sending, one more attempt) and returns what their
	 * messages need. A row another worker holds, or one already sent, is not returned.
	 */
	async claim(ids: number[], leaseMs: number, domain: string): Promise<ClaimedReminder[]> {
		if (ids.length === 0) return [];
		const rows = await db.execute<Record<string, unknown>>(sql`
			with claimed as (
				update reminders set state = 'sending', claimed_at = now(), attempts = attempts + 1, updated_at = now(),
					message_id = coalesce(message_id, case when channel = 'email-digest'
						then '<digest-' || user_id || '-' || extract(epoch from due_at)::bigint || '@' || ${domain} || '>'
						else '<reminder-' || id || '@' || ${domain} || '>' end)
				 where id in ${sql.raw(`(${ids.map((i) => Number(i)).join(',')})`)} and due_at <= now()
				   and ((state = 'due' and (retry_at is null or retry_at <= now()))
				     or (state = 'sending' and claimed_at < now() - make_interval(secs => ${leaseMs / 1000})))
				returning id, step_id, plant_id, user_id, channel, due_at, message_id, attempts)
			select c.*, u.email, u.name, cu.name as cultivar, pr.unsubscribe_token,
				s.uid, s.sequence, s.changed_at, s.title, s.detail, s.earliest::text, s.likely::text, s.latest::text, s.generation,
				s.amount, s.nutrients, s.cautions, s.guide, s.restricted
			  from claimed c
			  join users u on u.id = c.user_id
			  join plants p on p.id = c.plant_id
			  join cultivars cu on cu.id = p.cultivar_id
			  left join reminder_preferences pr on pr.user_id = c.user_id
			  left join plan_steps s on s.id = c.step_id
			 order by c.user_id, c.due_at, s.likely, c.id`);
		return [...rows].map((r) => ({
			id: Number(r.id),
			userId: Number(r.user_id),
			plantId: Number(r.plant_id),
			channel: r.channel as ReminderChannel,
			dueAt: new Date(r.due_at as string),
			messageId: r.message_id as string,
			attempts: Number(r.attempts),
			email: r.email as string,
			name: r.name as string,
			cultivar: r.cultivar as string,
			unsubscribeToken: (r.unsubscribe_token as string | null) ?? null,
			step:
				r.uid == null
					? null
					: {
							uid: r.uid as string,
							sequence: Number(r.sequence),
							changedAt: new Date(r.changed_at as string),
							title: r.title as string,
							detail: r.detail as string,
							earliest: r.earliest as string,
							likely: r.likely as string,
							latest: r.latest as string,
							generation: Number(r.generation),
							amount: (r.amount as Amount | null) ?? null,
							nutrients: (r.nutrients as Nutrients | null) ?? null,
							cautions: (r.cautions as string[] | null) ?? null,
							guide: (r.guide as string | null) ?? null,
							restricted: Boolean(r.restricted)
						}
		}));
	},

	markSent: (ids: number[]) =>
		db.execute(sql`update reminders set state = 'sent', sent_at = now(), updated_at = now(), last_error = null
			where id in ${sql.raw(`(${ids.map(Number).join(',')})`)} and state = 'sending'`),

	/** Keeps a send job's claim alive while its messages go out, so a slow batch is not taken over. */
	renewClaim: (ids: number[]) =>
		db.execute(sql`update reminders set claimed_at = now()
			where id in ${sql.raw(`(${ids.map(Number).join(',')})`)} and state = 'sending'`),

	/** A temporary refusal: due again after the delay, picked by a later tick. */
	markRetry: (ids: number[], error: string, retryInMs: number) =>
		db.execute(sql`update reminders set state = 'due', last_error = ${error}, queued_at = null, updated_at = now(),
			retry_at = now() + make_interval(secs => ${retryInMs / 1000})
			where id in ${sql.raw(`(${ids.map(Number).join(',')})`)} and state = 'sending'`),

	markFailed: (ids: number[], error: string) =>
		db.execute(sql`update reminders set state = 'failed', last_error = ${error}, updated_at = now()
			where id in ${sql.raw(`(${ids.map(Number).join(',')})`)} and state = 'sending'`),

	markSkipped: (ids: number[], why: string) =>
		db.execute(sql`update reminders set state = 'skipped', last_error = ${why}, updated_at = now()
			where id in ${sql.raw(`(${ids.map(Number).join(',')})`)} and state = 'sending'`),

	staffCount: async (f: StaffFilter) => db.$count(reminders, staffWhere(f)),

	staffPage: (f: StaffFilter, limit: number, offset: number) =>
		db
			.select({
				id: reminders.id,
				plantId: reminders.plantId,
				title: reminders.title,
				channel: reminders.channel,
				dueAt: reminders.dueAt,
				state: reminders.state,
				attempts: reminders.attempts,
				lastError: reminders.lastError,
				sentAt: reminders.sentAt,
				messageId: reminders.messageId,
				email: users.email,
				cultivar: cultivars.name
			})
			.from(reminders)
			.innerJoin(users, eq(users.id, reminders.userId))
			.innerJoin(plants, eq(plants.id, reminders.plantId))
			.innerJoin(cultivars, eq(cultivars.id, plants.cultivarId))
			.where(staffWhere(f))
			.orderBy(desc(reminders.updatedAt), desc(reminders.id))
			.limit(limit)
			.offset(offset),

	countsByState: async (plantId?: number) =>
		(
			await db
				.select({ state: reminders.state, n: sql<number>`count(*)::int` })
				.from(reminders)
				.where(plantId ? eq(reminders.plantId, plantId) : undefined)
				.groupBy(reminders.state)
		).reduce((acc, r) => ({ ...acc, [r.state]: r.n }), {} as Partial<Record<ReminderState, number>>),

	/** A failed reminder goes back to the queue at once; its history (attempts, last error) stays. */
	async resend(id: number, now: Date): Promise<boolean> {
		const rows = await db
			.update(reminders)
			.set({ state: 'due', retryAt: null, queuedAt: null, updatedAt: now })
			.where(and(eq(reminders.id, id), eq(reminders.state, 'failed')))
			.returning({ id: reminders.id });
		return rows.length === 1;
	}
};

export type ReminderRepository = typeof reminderRepository;
