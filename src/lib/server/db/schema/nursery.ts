import { boolean, integer, jsonb, pgTable, real, text, timestamp } from 'drizzle-orm/pg-core';
import { UNITS } from '../../../care/vocabulary';
import { defaultFeeding } from '../../../care/feeding';

/** One row: the nursery this instance serves. */
export const nurserySettings = pgTable('nursery_settings', {
	id: integer('id').primaryKey().default(1),
	name: text('name').notNull(),
	town: text('town').notNull(),
	market: text('market').notNull(),
	units: text('units', { enum: UNITS }).notNull().default('metric'),
	timeZone: text('time_zone').notNull().default('UTC'),
	defaultClimate: text('default_climate').notNull(),
	fertilizerName: text('fertilizer_name').notNull(),
	npk: jsonb('npk').$type<[number, number, number]>().notNull(),
	/** The scoop the plans measure with: the plan's full ration (one level can) and one handful, grams. */
	fullRationG: real('full_ration_g').notNull().default(defaultFeeding.fullRationG),
	handfulG: real('handful_g').notNull().default(defaultFeeding.handfulG),
	restrictedMonths: jsonb('restricted_months').$type<number[]>().notNull().default([]),
	nitrogenCapKgPer100m2: real('nitrogen_cap_kg_per_100m2'),
	demo: boolean('demo').notNull().default(false),
	updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow()
});
