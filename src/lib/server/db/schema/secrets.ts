import { pgTable, text } from 'drizzle-orm/pg-core';

import { createdAt } from './columns';

/**
 * Secrets the server generates for itself outside production (demo and tests), so every process
 * sharing the database (app, seed, tests) derives the same values. Production takes them from
 * the environment instead and never reads this table.
 */
export const serverSecrets = pgTable('server_secrets', {
	name: text('name').primaryKey(),
	value: text('value').notNull(),
	createdAt: createdAt()
});
