import { timestamp } from 'drizzle-orm/pg-core';

/** When a row was written; every table has one. */
export const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow();
