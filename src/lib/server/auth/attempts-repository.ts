import { and, count, eq, gte, inArray, lt } from 'drizzle-orm';
import { db } from '../db';
import { signInAttempts } from '../db/schema';

/** Rows of counted attempts (sign-ins, mails sent, sign-ups), keyed by what is limited. */
export const attemptsRepository = {
	insert: async (key: string) => (await db.insert(signInAttempts).values({ key }).returning({ id: signInAttempts.id }))[0].id,
	countSince: async (key: string, since: Date) =>
		(await db.select({ n: count() }).from(signInAttempts).where(and(eq(signInAttempts.key, key), gte(signInAttempts.at, since))))[0]?.n ?? 0,
	deleteIds: (ids: number[]) => db.delete(signInAttempts).where(inArray(signInAttempts.id, ids)),
	deleteKey: (key: string) => db.delete(signInAttempts).where(eq(signInAttempts.key, key)),
	deleteBefore: (before: Date) => db.delete(signInAttempts).where(lt(signInAttempts.at, before))
};
