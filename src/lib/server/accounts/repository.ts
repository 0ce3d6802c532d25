import { and, asc, count, eq, gt, inArray, isNull } from 'drizzle-orm';
import { db } from '../db';
import { emailTokens, invitations, users } from '../db/schema';
import { TEAM_ROLES, type Role } from '../../schema/auth';

export type UserRow = typeof users.$inferSelect;
export type InvitationRow = typeof invitations.$inferSelect;
type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];
type Conn = typeof db | Tx;
export type TokenPurpose = 'verify-email' | 'reset-password';

const teamOnly = inArray(users.role, [...TEAM_ROLES]);

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

	/** The nursery's team (owners and staff), in an order a role change does not disturb. */
	listTeam: (limit: number, offset: number) =>
		db.select({ id: users.id, email: users.email, name: users.name, role: users.role, emailVerifiedAt: users.emailVerifiedAt })
			.from(users).where(teamOnly).orderBy(asc(users.name), asc(users.id)).limit(limit).offset(offset),

	countTeam: async () => (await db.select({ n: count() }).from(users).where(teamOnly))[0]?.n ?? 0,

	countByRole: () => db.select({ role: users.role, n: count() }).from(users).groupBy(users.role),

	/** The owners' rows, locked until the transaction ends, so two demotions cannot both pass a count. */
	lockOwners: (c: Conn) => c.select({ id: users.id }).from(users).where(eq(users.role, 'owner')).for('update'),

	insertToken: (values: typeof emailTokens.$inferInsert, c: Conn = db) => c.insert(emailTokens).values(values),

	/** A live token of that purpose, without using it up (the cheap check before any expensive work). */
	findLiveToken: async (tokenHash: string, purpose: TokenPurpose, now: Date) =>
		(await db.select().from(emailTokens).where(and(eq(emailTokens.tokenHash, tokenHash), eq(emailTokens.purpose, purpose), isNull(emailTokens.usedAt), gt(emailTokens.expiresAt, now))))[0],

	/** Marks a live token used and returns it; a used or expired token returns nothing. */
	consumeToken: async (tokenHash: string, purpose: TokenPurpose, now: Date, c: Conn = db) =>
		(
			await c
				.update(emailTokens)
				.set({ usedAt: now })
				.where(and(eq(emailTokens.tokenHash, tokenHash), eq(emailTokens.purpose, purpose), isNull(emailTokens.usedAt), gt(emailTokens.expiresAt, now)))
				.returning()
		)[0],

	/** Every still-open link of that purpose for the user stops working. */
	expireTokens: (userId: number, purpose: TokenPurpose, now: Date, c: Conn = db) =>
		c.update(emailTokens).set({ usedAt: now }).where(and(eq(emailTokens.userId, userId), eq(emailTokens.purpose, purpose), isNull(emailTokens.usedAt))),

	/** Pending invitations to the address give way to the new one, in one transaction. */
	replaceInvitation: (values: typeof invitations.$inferInsert, now: Date) =>
		db.transaction(async (tx) => {
			await tx
				.update(invitations)
				.set({ replacedAt: now })
				.where(and(eq(invitations.email, values.email), isNull(invitations.acceptedAt), isNull(invitations.replacedAt)));
			return (await tx.insert(invitations).values(values).returning())[0];
		}),

	findInvitation: async (tokenHash: string, c: Conn = db) => (await c.select().from(invitations).where(eq(invitations.tokenHash, tokenHash)))[0],

	findInvitationById: async (id: number) => (await db.select().from(invitations).where(eq(invitations.id, id)))[0],

	/** Gives a still-pending invitation its e-mailed token; false when it was replaced or used meanwhile. */
	setInvitationToken: async (id: number, tokenHash: string) =>
		(
			await db
				.update(invitations)
				.set({ tokenHash })
				.where(and(eq(invitations.id, id), isNull(invitations.acceptedAt), isNull(invitations.replacedAt)))
				.returning({ id: invitations.id })
		).length > 0,

	/** Marks a pending invitation accepted; false if someone else's request got there first. */
	markInvitationAccepted: async (id: number, now: Date, c: Conn = db) =>
		(
			await c
				.update(invitations)
				.set({ acceptedAt: now })
				.where(and(eq(invitations.id, id), isNull(invitations.acceptedAt), isNull(invitations.replacedAt), gt(invitations.expiresAt, now)))
				.returning({ id: invitations.id })
		).length > 0,

	listOpenInvitations: (now: Date) =>
		db.select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt })
			.from(invitations)
			.where(and(isNull(invitations.acceptedAt), isNull(invitations.replacedAt), gt(invitations.expiresAt, now)))
			.orderBy(asc(invitations.email))
};
