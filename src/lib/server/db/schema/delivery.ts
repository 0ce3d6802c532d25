import { sql } from 'drizzle-orm';
import { index, integer, pgEnum, pgTable, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import { REMINDER_CHANNELS, REMINDER_MODES, REMINDER_STATES } from '../../../schema/delivery';
import { users } from './auth';
import { createdAt } from './columns';
import { planSteps } from './plans';
import { plants } from './plants';

export const reminderModeEnum = pgEnum('reminder_mode', REMINDER_MODES);
export const reminderChannelEnum = pgEnum('reminder_channel', REMINDER_CHANNELS);
export const reminderStateEnum = pgEnum('reminder_state', REMINDER_STATES);

/**
 * A subscribed calendar: one plant, or (plant_id null) all of a gardener's plants. Only a hash of
 * the token is stored. The rendered calendar is kept with its ETag and the plan version it was
 * rendered from, so requests serve stored bytes and a changed plan re-renders it once.
 */
export const calendarFeeds = pgTable(
	'calendar_feeds',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		userId: integer('user_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		plantId: integer('plant_id').references(() => plants.id, { onDelete: 'cascade' }),
		tokenHash: text('token_hash').notNull(),
		revokedAt: timestamp('revoked_at', { withTimezone: true }),
		ics: text('ics'),
		etag: text('etag'),
		/** Latest change among the calendar's steps (Last-Modified). */
		lastModified: timestamp('last_modified', { withTimezone: true }),
		/** Which plan state `ics` was rendered from; a mismatch re-renders. */
		renderedVersion: text('rendered_version'),
		createdAt: createdAt()
	},
	(t) => [uniqueIndex('calendar_feeds_token_key').on(t.tokenHash), index('calendar_feeds_user_idx').on(t.userId), index('calendar_feeds_plant_idx').on(t.plantId)]
);

/** A gardener's reminder choices. Without a row: each step, at 08:00 in the nursery's time zone. */
export const reminderPreferences = pgTable('reminder_preferences', {
	userId: integer('user_id')
		.primaryKey()
		.references(() => users.id, { onDelete: 'cascade' }),
	mode: reminderModeEnum('mode').notNull().default('each-step'),
	hour: integer('hour').notNull().default(8),
	timeZone: text('time_zone').notNull(),
	/**
	 * Put in every reminder's unsubscribe link. Kept as it is (not hashed) because the worker must
	 * write it into each message; it can do nothing but turn reminders off.
	 */
	unsubscribeToken: text('unsubscribe_token').notNull(),
	updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
}, (t) => [uniqueIndex('reminder_preferences_unsubscribe_key').on(t.unsubscribeToken)]);

/**
 * The source of truth for reminders: one row per plan step, channel and due time. Workers claim a
 * row (due → sending) before sending and mark it sent after; `message_id` is deterministic, so a
 * message re-sent after a crash carries the same Message-ID.
 */
export const reminders = pgTable(
	'reminders',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		/** Null once the step left the plan; the row stays as the record of what was sent. */
		stepId: integer('step_id').references(() => planSteps.id, { onDelete: 'set null' }),
		plantId: integer('plant_id')
			.notNull()
			.references(() => plants.id, { onDelete: 'cascade' }),
		userId: integer('user_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		channel: reminderChannelEnum('channel').notNull(),
		dueAt: timestamp('due_at', { withTimezone: true }).notNull(),
		state: reminderStateEnum('state').notNull().default('due'),
		attempts: integer('attempts').notNull().default(0),
		lastError: text('last_error'),
		messageId: text('message_id'),
		/** The step's title when the row was last planned, for the staff view once the step is gone. */
		title: text('title').notNull(),
		/** A retry after a temporary refusal waits until then. */
		retryAt: timestamp('retry_at', { withTimezone: true }),
		/** When a tick last queued a send job for it; a lost job is queued again later. */
		queuedAt: timestamp('queued_at', { withTimezone: true }),
		claimedAt: timestamp('claimed_at', { withTimezone: true }),
		sentAt: timestamp('sent_at', { withTimezone: true }),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
		createdAt: createdAt()
	},
	(t) => [
		uniqueIndex('reminders_step_channel_due_key').on(t.stepId, t.channel, t.dueAt),
		index('reminders_pending_idx')
			.on(t.dueAt)
			.where(sql`state in ('due', 'sending')`),
		index('reminders_plant_idx').on(t.plantId, t.dueAt),
		index('reminders_user_idx').on(t.userId, t.dueAt),
		index('reminders_state_updated_idx').on(t.state, t.updatedAt)
	]
);
