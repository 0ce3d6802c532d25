import { index, integer, pgEnum, pgTable, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import { ROLES } from '../../../schema/auth';
import { UNITS } from '../../../care/vocabulary';

export const roleEnum = pgEnum('role', ROLES);
export const tokenPurposeEnum = pgEnum('token_purpose', ['verify-email', 'reset-password']);

import { createdAt } from './columns';

export const users = pgTable(
	'users',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		email: text('email').notNull(),
		name: text('name').notNull(),
		passwordHash: text('password_hash').notNull(),
		role: roleEnum('role').notNull().default('gardener'),
		emailVerifiedAt: timestamp('email_verified_at', { withTimezone: true }),
		units: text('units', { enum: UNITS }).notNull().default('metric'),
		createdAt: createdAt()
	},
	(t) => [uniqueIndex('users_email_key').on(t.email)]
);

export const sessions = pgTable(
	'sessions',
	{
		id: text('id').primaryKey(),
		userId: integer('user_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
		createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow()
	},
	(t) => [index('sessions_user_idx').on(t.userId)]
);

/** Single-use e-mailed links; only a hash of the token is stored. */
export const emailTokens = pgTable(
	'email_tokens',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		userId: integer('user_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		purpose: tokenPurposeEnum('purpose').notNull(),
		tokenHash: text('token_hash').notNull(),
		expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
		usedAt: timestamp('used_at', { withTimezone: true }),
		createdAt: createdAt()
	},
	(t) => [uniqueIndex('email_tokens_hash_key').on(t.tokenHash), index('email_tokens_user_idx').on(t.userId, t.purpose)]
);

export const invitations = pgTable(
	'invitations',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		email: text('email').notNull(),
		role: roleEnum('role').notNull(),
		tokenHash: text('token_hash').notNull(),
		invitedBy: integer('invited_by')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
		acceptedAt: timestamp('accepted_at', { withTimezone: true }),
		/** Set when a newer invitation to the same address took this one's place; its link then says so. */
		replacedAt: timestamp('replaced_at', { withTimezone: true }),
		createdAt: createdAt()
	},
	(t) => [uniqueIndex('invitations_hash_key').on(t.tokenHash), index('invitations_email_idx').on(t.email)]
);

/** Sign-in attempts, counted per key ("email:…" or "ip:…") so every app instance shares the limit. */
export const signInAttempts = pgTable(
	'sign_in_attempts',
	{
		id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
		key: text('key').notNull(),
		at: timestamp('at', { withTimezone: true }).notNull().defaultNow()
	},
	(t) => [index('sign_in_attempts_key_at_idx').on(t.key, t.at), index('sign_in_attempts_at_idx').on(t.at)]
);
