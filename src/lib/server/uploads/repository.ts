/** Queries of the uploads table. Queries only. */
import { eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { uploads, users } from '../db/schema';
import type { Conn } from '../db/tx';

export type UploadRow = typeof uploads.$inferSelect;

export const uploadsRepository = {
	byId: async (id: number, c: Conn = db) => (await c.select().from(uploads).where(eq(uploads.id, id)))[0],
	/** Locks the owner's row so two uploads at once cannot both slip under the allowance. */
	lockOwner: (c: Conn, ownerId: number) => c.select({ id: users.id }).from(users).where(eq(users.id, ownerId)).for('update'),
	bytesUsed: async (c: Conn, ownerId: number) =>
		(await c.select({ n: sql<number>`coalesce(sum(${uploads.bytes}), 0)::int` }).from(uploads).where(eq(uploads.ownerId, ownerId)))[0]?.n ?? 0,
	insert: async (c: Conn, values: typeof uploads.$inferInsert) => (await c.insert(uploads).values(values).returning())[0]!,
	delete: async (c: Conn, id: number) => (await c.delete(uploads).where(eq(uploads.id, id)).returning())[0]
};
export type UploadsRepository = typeof uploadsRepository;
