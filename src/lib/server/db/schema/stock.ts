import { sql } from 'drizzle-orm';
import { check, date, index, integer, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import type { MovementKind } from '../../../schema/stock';
import { users } from './auth';
import { cultivars } from './catalogue';

import { createdAt } from './columns';

/** A day at a market: stock can be loaded for it and sales are made on it. */
export const marketDays = pgTable(
	'market_days',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		on: date('on').notNull(),
		place: text('place').notNull(),
		createdAt: createdAt()
	},
	(t) => [uniqueIndex('market_days_on_place_key').on(t.on, t.place)]
);

/**
 * Plants of one cultivar potted on the same day (so a plant's age at any sale is known), with the
 * count on hand and where they are: at the nursery (no market day) or loaded for a market day.
 */
export const stockBatches = pgTable(
	'stock_batches',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		cultivarId: integer('cultivar_id')
			.notNull()
			.references(() => cultivars.id),
		pottedOn: date('potted_on').notNull(),
		onHand: integer('on_hand').notNull(),
		marketDayId: integer('market_day_id').references(() => marketDays.id),
		createdAt: createdAt()
	},
	(t) => [
		check('stock_batches_on_hand_not_negative', sql`${t.onHand} >= 0`),
		index('stock_batches_cultivar_idx').on(t.cultivarId),
		index('stock_batches_market_day_idx').on(t.marketDayId)
	]
);

/** Every change to a batch's count, with its reason: the stock's audit trail. */
export const stockMovements = pgTable(
	'stock_movements',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		batchId: integer('batch_id')
			.notNull()
			.references(() => stockBatches.id, { onDelete: 'cascade' }),
		change: integer('change').notNull(),
		kind: text('kind').$type<MovementKind>().notNull(),
		reason: text('reason').notNull().default(''),
		userId: integer('user_id').references(() => users.id, { onDelete: 'set null' }),
		at: createdAt()
	},
	(t) => [index('stock_movements_batch_idx').on(t.batchId, t.at)]
);

/** One sale of one or more plants from one batch; `clientId` makes a resent sale land once. */
export const sales = pgTable(
	'sales',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		clientId: uuid('client_id').notNull(),
		batchId: integer('batch_id').references(() => stockBatches.id, { onDelete: 'set null' }),
		cultivarId: integer('cultivar_id')
			.notNull()
			.references(() => cultivars.id),
		marketDayId: integer('market_day_id').references(() => marketDays.id),
		soldOn: date('sold_on').notNull(),
		quantity: integer('quantity').notNull(),
		pricePerPlantCents: integer('price_per_plant_cents').notNull(),
		buyerEmail: text('buyer_email'),
		soldBy: integer('sold_by').references(() => users.id, { onDelete: 'set null' }),
		/** Undone within the undo window: the stock went back and the plants were removed; kept so a resent sale stays undone. */
		undoneAt: timestamp('undone_at', { withTimezone: true }),
		createdAt: createdAt()
	},
	(t) => [
		uniqueIndex('sales_client_id_key').on(t.clientId),
		check('sales_quantity_positive', sql`${t.quantity} > 0`),
		check('sales_price_not_negative', sql`${t.pricePerPlantCents} >= 0`),
		index('sales_sold_on_idx').on(t.soldOn),
		index('sales_market_day_idx').on(t.marketDayId)
	]
);
