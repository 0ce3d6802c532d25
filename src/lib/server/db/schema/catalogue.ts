import { boolean, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import { sql } from 'drizzle-orm';
import type { Provenance, Sourced } from '../../../care/types';
import { users } from './auth';

import { createdAt } from './columns';

/**
 * The nursery's cultivar catalogue. Built-in rows are seeded from the engine's catalogue
 * (src/lib/care/catalogue); the owner edits them here. `parameters` holds the engine's plan
 * parameters by name, each with its source, so a nursery's own value says so.
 */
export const cultivars = pgTable(
	'cultivars',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		slug: text('slug').notNull(),
		name: text('name').notNull(),
		group: text('group').notNull(),
		subgroup: text('subgroup').notNull(),
		size: text('size').notNull(),
		notes: text('notes').notNull().default(''),
		parameters: jsonb('parameters').$type<Record<string, Sourced<number>>>().notNull(),
		/** Usual price of one plant in the smallest currency unit (cents), filled in on the stall. */
		usualPriceCents: integer('usual_price_cents'),
		builtIn: boolean('built_in').notNull().default(false),
		/** Retired from sale: hidden from the stall and the public catalogue; plants already sold keep it. */
		retiredAt: timestamp('retired_at', { withTimezone: true }),
		createdAt: createdAt(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [uniqueIndex('cultivars_slug_key').on(t.slug), index('cultivars_name_idx').on(t.name)]
);

/** Every change to a cultivar: who, when, which field, the old and the new value. */
export const cultivarChanges = pgTable(
	'cultivar_changes',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		cultivarId: integer('cultivar_id')
			.notNull()
			.references(() => cultivars.id, { onDelete: 'cascade' }),
		userId: integer('user_id').references(() => users.id, { onDelete: 'set null' }),
		field: text('field').notNull(),
		oldValue: jsonb('old_value'),
		newValue: jsonb('new_value'),
		at: createdAt()
	},
	(t) => [index('cultivar_changes_cultivar_idx').on(t.cultivarId, t.at)]
);

/** Climate profiles: the engine's built-in ones and the nursery's own (12 monthly means, January first). */
export const climateProfiles = pgTable(
	'climate_profiles',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		slug: text('slug').notNull(),
		name: text('name').notNull(),
		monthlyMeanC: jsonb('monthly_mean_c').$type<number[]>().notNull(),
		source: jsonb('source').$type<Provenance>().notNull(),
		builtIn: boolean('built_in').notNull().default(false),
		createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
		createdAt: createdAt(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [uniqueIndex('climate_profiles_slug_key').on(t.slug)]
);

/** Addresses waiting for a sold-out cultivar; each gets one e-mail when stock arrives. */
export const waitlistEntries = pgTable(
	'waitlist_entries',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		cultivarId: integer('cultivar_id')
			.notNull()
			.references(() => cultivars.id, { onDelete: 'cascade' }),
		email: text('email').notNull(),
		/** Hash of the one-click leave token. */
		leaveTokenHash: text('leave_token_hash').notNull(),
		notifiedAt: timestamp('notified_at', { withTimezone: true }),
		createdAt: createdAt()
	},
	(t) => [
		uniqueIndex('waitlist_cultivar_email_key').on(t.cultivarId, t.email),
		uniqueIndex('waitlist_leave_token_key').on(t.leaveTokenHash),
		index('waitlist_pending_idx').on(t.cultivarId).where(sql`notified_at is null`)
	]
);


/**
 * One row: a counter raised in the same transaction as every write to cultivars, climate profiles
 * or the nursery settings. Each app instance caches the catalogue in memory and re-reads it only
 * when this number moved, so several instances stay correct with one tiny read per request.
 */
export const catalogueVersion = pgTable('catalogue_version', {
	id: integer('id').primaryKey().default(1),
	version: integer('version').notNull().default(0),
	changedAt: timestamp('changed_at', { withTimezone: true }).notNull().defaultNow()
});
