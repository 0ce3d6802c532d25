import { sql } from 'drizzle-orm';
import { date, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, type AnyPgColumn } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { climateProfiles, cultivars } from './catalogue';
import { sales } from './stock';

/**
 * A plant sold (or divided from a mat). Until it is claimed it has a claim code (only its hash is
 * stored) and no gardener; claiming sets the gardener, planting date, climate and units.
 */
export const plants = pgTable(
	'plants',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		saleId: integer('sale_id').references(() => sales.id, { onDelete: 'cascade' }),
		cultivarId: integer('cultivar_id')
			.notNull()
			.references(() => cultivars.id),
		soldOn: date('sold_on').notNull(),
		ageAtSaleWeeks: integer('age_at_sale_weeks').notNull(),
		claimCodeHash: text('claim_code_hash'),
		/** Raised when staff reissue a claim code, so the old one stops working. */
		claimVersion: integer('claim_version').notNull().default(1),
		claimedAt: timestamp('claimed_at', { withTimezone: true }),
		gardenerId: integer('gardener_id').references(() => users.id, { onDelete: 'set null' }),
		plantedOn: date('planted_on'),
		ageAtPlantingWeeks: integer('age_at_planting_weeks'),
		climateProfileId: integer('climate_profile_id').references(() => climateProfiles.id),
		/** The gardener's own twelve monthly means, when no profile fits. */
		customMonthlyMeanC: jsonb('custom_monthly_mean_c').$type<number[]>(),
		units: text('units', { enum: ['metric', 'imperial'] }),
		parentPlantId: integer('parent_plant_id').references((): AnyPgColumn => plants.id, { onDelete: 'set null' }),
		archivedAt: timestamp('archived_at', { withTimezone: true }),
		// Kept current by plan regeneration and the milestone log, so the nursery's table can filter
		// and sort hundreds of thousands of plants by index without recomputing plans.
		stage: text('stage'),
		nextStepOn: date('next_step_on'),
		nextStepKind: text('next_step_kind'),
		lastMilestoneOn: date('last_milestone_on'),
		lastMilestoneKind: text('last_milestone_kind'),
		planChangedAt: timestamp('plan_changed_at', { withTimezone: true }),
		/** The fingerprint of the engine that wrote the stored plan (src/lib/server/plans/engine.ts). */
		planEngine: text('plan_engine'),
		createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [
		uniqueIndex('plants_claim_code_key').on(t.claimCodeHash),
		index('plants_gardener_idx').on(t.gardenerId),
		index('plants_sale_idx').on(t.saleId),
		// The nursery's table filters by cultivar and sorts by next step at once (also serves the foreign key).
		index('plants_cultivar_idx').on(t.cultivarId, t.nextStepOn, t.id),
		index('plants_parent_idx').on(t.parentPlantId),
		index('plants_next_step_idx').on(t.nextStepOn, t.id),
		index('plants_stage_idx').on(t.stage, t.nextStepOn, t.id),
		// Cultivar and stage together: the filtered page in next-step order, and its count from the index alone.
		index('plants_cultivar_stage_idx').on(t.cultivarId, t.stage, t.nextStepOn, t.id),
		// The table's other sorts, each with the id as tie-breaker so a page is one index scan.
		index('plants_sold_on_idx').on(t.soldOn, t.id),
		index('plants_last_milestone_idx').on(t.lastMilestoneOn, t.id),
		// Age sorts by the day growth started: the sale day less the age then.
		index('plants_started_idx').on(sql`(${t.soldOn} - ${t.ageAtSaleWeeks} * 7)`, t.id)
	]
);
