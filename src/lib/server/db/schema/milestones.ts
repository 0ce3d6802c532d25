import { date, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { LOSS_REASONS, MILESTONE_KINDS } from '../../../plants/milestones';
import type { ChangeCause } from '../../../plants/changes';
import { users } from './auth';
import { createdAt } from './columns';
import { plants } from './plants';
import { uploads } from './uploads';

export const milestoneKindEnum = pgEnum('milestone_kind', MILESTONE_KINDS);
export const lossReasonEnum = pgEnum('loss_reason', LOSS_REASONS);

/** Something the gardener logged about one stem of the mat; the plan is re-timed from these. */
export const milestones = pgTable(
	'milestones',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		plantId: integer('plant_id')
			.notNull()
			.references(() => plants.id, { onDelete: 'cascade' }),
		/** 0 the plant as sold, 1 its first follower, … */
		generation: integer('generation').notNull().default(0),
		kind: milestoneKindEnum('kind').notNull(),
		on: date('on').notNull(),
		leaves: integer('leaves'),
		hands: integer('hands'),
		bunchMassG: integer('bunch_mass_g'),
		lossReason: lossReasonEnum('loss_reason'),
		note: text('note').notNull().default(''),
		photoId: integer('photo_id').references(() => uploads.id, { onDelete: 'set null' }),
		/** For a division: the new plant it became. */
		dividedPlantId: integer('divided_plant_id').references(() => plants.id, { onDelete: 'set null' }),
		createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
		createdAt: createdAt(),
		updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [
		index('milestones_plant_idx').on(t.plantId, t.on),
		index('milestones_photo_idx').on(t.photoId),
		index('milestones_divided_plant_idx').on(t.dividedPlantId)
	]
);

/** One step that moved in one regeneration: by how many days, and because of what. */
export const planChanges = pgTable(
	'plan_changes',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		plantId: integer('plant_id')
			.notNull()
			.references(() => plants.id, { onDelete: 'cascade' }),
		/** The regeneration's time: every row of one regeneration shares it (and the plant's plan_changed_at). */
		changedAt: timestamp('changed_at', { withTimezone: true }).notNull(),
		stepUid: uuid('step_uid').notNull(),
		generation: integer('generation').notNull(),
		kind: text('kind').notNull(),
		occurrence: integer('occurrence').notNull(),
		fromLikely: date('from_likely').notNull(),
		toLikely: date('to_likely').notNull(),
		days: integer('days').notNull(),
		cause: jsonb('cause').$type<ChangeCause>().notNull()
	},
	(t) => [index('plan_changes_plant_idx').on(t.plantId, t.changedAt)]
);
