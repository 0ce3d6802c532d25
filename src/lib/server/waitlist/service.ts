/**
 * The waitlist for sold-out cultivars. Anyone may leave an address; when stock of the cultivar
 * arrives each waiting address gets one e-mail, with a link that takes it off the list in one
 * click. Only a hash of that link's token is stored.
 */
import { and, eq, isNull } from 'drizzle-orm';
import { cultivars, waitlistEntries } from '../db/schema';
import { hashToken, newToken } from '../auth/tokens';
import { UserFacingError } from '../errors';
import type { AnyDb } from '../secrets';

export interface WaitlistDeps {
	db: AnyDb;
	link: (path: string) => string;
	mail: (m: { to: string; subject: string; text: string }) => Promise<boolean>;
	nursery: () => Promise<{ name: string; town: string }>;
}

export const leavePath = (token: string) => `/cultivars/leave?token=${token}`;

export function createWaitlistService({ db, link, mail, nursery }: WaitlistDeps) {
	return {
		/** Adds the address (once per cultivar); returns the leave token for the page to offer at once. */
		async join(input: { cultivar: string; email: string }, inStock: (cultivarId: number) => Promise<boolean>) {
			const [cultivar] = await db.select().from(cultivars).where(eq(cultivars.slug, input.cultivar));
			if (!cultivar || cultivar.retiredAt) throw new UserFacingError('cultivar', 'Unknown cultivar: choose one from the list');
			if (await inStock(cultivar.id)) throw new UserFacingError('cultivar', `${cultivar.name} is in stock: ask at the stall or the nursery`, 409);
			const token = newToken();
			const [row] = await db
				.insert(waitlistEntries)
				.values({ cultivarId: cultivar.id, email: input.email, leaveTokenHash: hashToken(token) })
				.onConflictDoUpdate({ target: [waitlistEntries.cultivarId, waitlistEntries.email], set: { leaveTokenHash: hashToken(token), notifiedAt: null } })
				.returning({ id: waitlistEntries.id });
			return { cultivarName: cultivar.name, token, id: row.id };
		},

		/** The entry a leave link points at, for the confirmation page. */
		async entry(token: string) {
			const [row] = await db
				.select({ email: waitlistEntries.email, cultivarName: cultivars.name })
				.from(waitlistEntries)
				.innerJoin(cultivars, eq(cultivars.id, waitlistEntries.cultivarId))
				.where(eq(waitlistEntries.leaveTokenHash, hashToken(token)));
			return row;
		},

		async leave(token: string) {
			const [row] = await db.delete(waitlistEntries).where(eq(waitlistEntries.leaveTokenHash, hashToken(token))).returning({ id: waitlistEntries.id });
			if (!row) throw new UserFacingError('token', 'This address is no longer on the list', 410);
		},

		/**
		 * Stock of a cultivar arrived: each address still waiting gets one e-mail. The entry is
		 * marked first (so two arrivals at once mail it once), with a fresh leave token for the mail.
		 */
		async notifyArrival(cultivarId: number) {
			const [cultivar] = await db.select().from(cultivars).where(eq(cultivars.id, cultivarId));
			if (!cultivar) return 0;
			const waiting = await db
				.select({ id: waitlistEntries.id })
				.from(waitlistEntries)
				.where(and(eq(waitlistEntries.cultivarId, cultivarId), isNull(waitlistEntries.notifiedAt)));
			const { name, town } = await nursery();
			let sent = 0;
			for (const { id } of waiting) {
				const token = newToken();
				const [claimed] = await db
					.update(waitlistEntries)
					.set({ notifiedAt: new Date(), leaveTokenHash: hashToken(token) })
					.where(and(eq(waitlistEntries.id, id), isNull(waitlistEntries.notifiedAt)))
					.returning({ email: waitlistEntries.email });
				if (!claimed) continue;
				const ok = await mail({
					to: claimed.email,
					subject: `${cultivar.name} is back in stock at ${name}`,
					text: `Hello,\n\nYou asked us to tell you when ${cultivar.name} is back: it is in stock now at ${name}, ${town}. Plants go quickly; ask at the stall or the nursery.\n\nThis is the only message about it. To leave the list:\n${link(leavePath(token))}\n\n${name}`
				});
				if (ok) sent++;
			}
			return sent;
		}
	};
}

export type WaitlistService = ReturnType<typeof createWaitlistService>;
