import { boolean, date, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import type { Amount, Nutrients } from '../../../care/types';
import { plants } from './plants';

/**
 * A plant's stored care plan: the engine's steps, regenerated inside one transaction whenever the
 * plan's inputs change. `uid` is random, kept across regenerations while the step still exists, so
 * calendars move events instead of adding copies; `sequence` rises each time the step moves.
 */
export const planSteps = pgTable(
	'plan_steps',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		plantId: integer('plant_id')
			.notNull()
			.references(() => plants.id, { onDelete: 'cascade' }),
		uid: uuid('uid').notNull().defaultRandom(),
		generation: integer('generation').notNull(),
		kind: text('kind').notNull(),
		/** Which occurrence of this kind in this generation (feedings repeat): with plant, generation and kind, the step's identity. */
		occurrence: integer('occurrence').notNull().default(0),
		title: text('title').notNull(),
		detail: text('detail').notNull().default(''),
		earliest: date('earliest').notNull(),
		likely: date('likely').notNull(),
		latest: date('latest').notNull(),
		amount: jsonb('amount').$type<Amount>(),
		nutrients: jsonb('nutrients').$type<Nutrients>(),
		cautions: jsonb('cautions').$type<string[]>(),
		guide: text('guide'),
		observed: boolean('observed').notNull().default(false),
		restricted: boolean('restricted').notNull().default(false),
		sequence: integer('sequence').notNull().default(0),
		changedAt: timestamp('changed_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [
		uniqueIndex('plan_steps_identity_key').on(t.plantId, t.generation, t.kind, t.occurrence),
		uniqueIndex('plan_steps_uid_key').on(t.uid),
		index('plan_steps_plant_likely_idx').on(t.plantId, t.likely)
	]
);
