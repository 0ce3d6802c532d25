import { and, asc, count, eq, gt, isNull } from 'drizzle-orm';
import { db } from '../db';
import { emailTokens, invitations, users } from '../db/schema';
import type { Role } from '../../schema/auth';

export type UserRow = typeof users.$inferSelect;
type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];
type Conn = typeof db | Tx;

export const accountsRepository = {
	transaction: <T>(fn: (tx: Tx) => Promise<T>) => db.transaction(fn),

	findByEmail: async (email: string, c: Conn = db) => (await c.select().from(users).where(eq(users.email, email)))[0],

	findById: async (id: number, c: Conn = db) => (await c.select().from(users).where(eq(users.id, id)))[0],

	insertUser: async (
		values: { email: string; name: string; passwordHash: string; role: Role; emailVerifiedAt?: Date | null },
		c: Conn = db
	) => (await c.insert(users).values(values).onConflictDoNothing({ target: users.email }).returning())[0],

	updateUser: (id: number, values: Partial<Pick<UserRow, 'passwordHash' | 'role' | 'emailVerifiedAt' | 'name' | 'units'>>, c: Conn = db) =>
		c.update(users).set(values).where(eq(users.id, id)),

	listUsers: (limit: number, offset: number) =>
		db.select({ id: users.id, email: users.email, name: users.name, role: users.role, emailVerifiedAt: users.emailVerifiedAt })
			.from(users).orderBy(asc(users.role), asc(users.email)).limit(limit).offset(offset),

	countUsers: async () => (await db.select({ n: count() }).from(users))[0]?.n ?? 0,

	countByRole: () => db.select({ role: users.role, n: count() }).from(users).groupBy(users.role),

	/** The owners' rows, locked until the transaction ends, so two demotions cannot both pass a count. */
	lockOwners: (c: Conn) => c.select({ id: users.id }).from(users).where(eq(users.role, 'owner')).for('update'),

	insertToken: (values: typeof emailTokens.$inferInsert, c: Conn = db) => c.insert(emailTokens).values(values),

	/** Marks a live token used and returns it; a used or expired token returns nothing. */
	consumeToken: async (tokenHash: string, purpose: 'verify-email' | 'reset-password', now: Date, c: Conn = db) =>
		(
			await c
				.update(emailTokens)
				.set({ usedAt: now })
				.where(and(eq(emailTokens.tokenHash, tokenHash), eq(emailTokens.purpose, purpose), isNull(emailTokens.usedAt), gt(emailTokens.expiresAt, now)))
				.returning()
		)[0],

	/** Every still-open link of that purpose for the user stops working. */
	expireTokens: (userId: number, purpose: 'verify-email' | 'reset-password', now: Date, c: Conn = db) =>
		c.update(emailTokens).set({ usedAt: now }).where(and(eq(emailTokens.userId, userId), eq(emailTokens.purpose, purpose), isNull(emailTokens.usedAt))),

	insertInvitation: (values: typeof invitations.$inferInsert) => db.insert(invitations).values(values),

	findLiveInvitation: async (tokenHash: string, now: Date, c: Conn = db) =>
		(await c.select().from(invitations).where(and(eq(invitations.tokenHash, tokenHash), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now))))[0],

	markInvitationAccepted: (id: number, now: Date, c: Conn = db) => c.update(invitations).set({ acceptedAt: now }).where(eq(invitations.id, id)),

	listOpenInvitations: (now: Date) =>
		db.select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt })
			.from(invitations).where(and(isNull(invitations.acceptedAt), gt(invitations.expiresAt, now))).orderBy(asc(invitations.email))
};
