import {
	burnPasswordCheck,
	clearSignInFailures,
	endAllSessions,
	hashPassword,
	hashToken,
	isSignInBlocked,
	newToken,
	recordSignInFailure,
	verifyPassword
} from '../auth';
import { UserFacingError } from '../errors';
import { absoluteUrl, sendMail } from '../mail';
import type { Role } from '../../schema/auth';
import { accountsRepository as repo } from './repository';

const HOUR = 60 * 60 * 1000;
export const TOKEN_LIFETIME_MS = { 'verify-email': 48 * HOUR, 'reset-password': 1 * HOUR, invite: 7 * 24 * HOUR } as const;

async function issueToken(userId: number, purpose: 'verify-email' | 'reset-password', now: Date) {
	const token = newToken();
	await repo.insertToken({ userId, purpose, tokenHash: hashToken(token), expiresAt: new Date(now.getTime() + TOKEN_LIFETIME_MS[purpose]) });
	return token;
}

async function sendVerification(user: { id: number; email: string; name: string }, origin: string, now: Date) {
	const token = await issueToken(user.id, 'verify-email', now);
	await sendMail({
		to: user.email,
		subject: 'Confirm your e-mail for Bunchline',
		text: `Hello ${user.name},\n\nConfirm your e-mail address to start using your care plans:\n\n${absoluteUrl(`/verify?token=${token}`, origin)}\n\nThe link works once and expires in 48 hours. If you did not sign up, ignore this message.\n\nBunchline`
	});
}

export const accounts = {
	async signUp(input: { name: string; email: string; password: string }, origin: string, now = new Date()) {
		const passwordHash = await hashPassword(input.password);
		const user = await repo.insertUser({ name: input.name, email: input.email, passwordHash, role: 'gardener' });
		if (!user) throw new UserFacingError('email', 'An account with this e-mail already exists: sign in or reset your password', 409);
		await sendVerification(user, origin, now);
		return user;
	},

	async resendVerification(email: string, origin: string, now = new Date()) {
		const user = await repo.findByEmail(email);
		if (user && !user.emailVerifiedAt) await sendVerification(user, origin, now);
	},

	async verifyEmail(token: string, now = new Date()) {
		const row = await repo.consumeToken(hashToken(token), 'verify-email', now);
		if (!row) throw new UserFacingError('token', 'This link has expired or was already used: sign in to get a new one', 410);
		await repo.updateUser(row.userId, { emailVerifiedAt: now });
		return row.userId;
	},

	async signIn(input: { email: string; password: string }, ip: string) {
		const key = { email: input.email, ip };
		if (await isSignInBlocked(key)) {
			throw new UserFacingError('form', 'Too many attempts: wait 15 minutes, or reset your password', 429);
		}
		const user = await repo.findByEmail(input.email);
		const ok = user ? await verifyPassword(user.passwordHash, input.password) : (await burnPasswordCheck(input.password), false);
		if (!user || !ok) {
			await recordSignInFailure(key);
			throw new UserFacingError('password', 'That e-mail and password do not match', 400);
		}
		if (!user.emailVerifiedAt) {
			throw new UserFacingError('email', 'Confirm your e-mail first: we sent you a link (you can ask for a new one below)', 403);
		}
		await clearSignInFailures(key);
		return user;
	},

	/** Always looks the same from outside, so it does not reveal who has an account. */
	async requestPasswordReset(email: string, origin: string, now = new Date()) {
		const user = await repo.findByEmail(email);
		if (!user) return;
		const token = await issueToken(user.id, 'reset-password', now);
		await sendMail({
			to: user.email,
			subject: 'Reset your Bunchline password',
			text: `Hello ${user.name},\n\nChoose a new password here:\n\n${absoluteUrl(`/reset?token=${token}`, origin)}\n\nThe link works once and expires in 1 hour. If you did not ask for it, ignore this message: your password stays as it is.\n\nBunchline`
		});
	},

	async resetPassword(input: { token: string; password: string }, now = new Date()) {
		const passwordHash = await hashPassword(input.password);
		const userId = await repo.transaction(async (tx) => {
			const row = await repo.consumeToken(hashToken(input.token), 'reset-password', now, tx);
			if (!row) throw new UserFacingError('token', 'This link has expired or was already used: request a new one', 410);
			// A reset proves control of the inbox, so it also confirms the address.
			const user = await repo.findById(row.userId, tx);
			await repo.updateUser(row.userId, { passwordHash, emailVerifiedAt: user?.emailVerifiedAt ?? now }, tx);
			return row.userId;
		});
		await endAllSessions(userId);
		return userId;
	},

	async invite(input: { email: string; role: Role }, invitedBy: number, origin: string, now = new Date()) {
		if (await repo.findByEmail(input.email)) {
			throw new UserFacingError('email', 'This person already has an account: change their role in the team list', 409);
		}
		const token = newToken();
		await repo.insertInvitation({ email: input.email, role: input.role, tokenHash: hashToken(token), invitedBy, expiresAt: new Date(now.getTime() + TOKEN_LIFETIME_MS.invite) });
		await sendMail({
			to: input.email,
			subject: 'You are invited to the Bunchline team',
			text: `Hello,\n\nYou are invited to join the nursery team on Bunchline as ${input.role}.\nSet your name and password here:\n\n${absoluteUrl(`/signup?invite=${token}`, origin)}\n\nThe link works once and expires in 7 days.\n\nBunchline`
		});
	},

	async findInvitation(token: string, now = new Date()) {
		return repo.findLiveInvitation(hashToken(token), now);
	},

	async acceptInvitation(input: { token: string; name: string; password: string }, now = new Date()) {
		const passwordHash = await hashPassword(input.password);
		return repo.transaction(async (tx) => {
			const inv = await repo.findLiveInvitation(hashToken(input.token), now, tx);
			if (!inv) throw new UserFacingError('token', 'This invitation has expired or was already used: ask the owner for a new one', 410);
			const user = await repo.insertUser({ email: inv.email, name: input.name, passwordHash, role: inv.role, emailVerifiedAt: now }, tx);
			if (!user) throw new UserFacingError('email', 'An account with this e-mail already exists: sign in instead', 409);
			await repo.markInvitationAccepted(inv.id, now, tx);
			return user;
		});
	},

	/** Only an owner changes roles (the route's guard), and the last owner cannot step down. */
	async changeRole(input: { userId: number; role: Role }, actingUserId: number) {
		await repo.transaction(async (tx) => {
			const target = await repo.findById(input.userId, tx);
			if (!target) throw new UserFacingError('userId', 'No such person', 404);
			if (target.role === 'owner' && input.role !== 'owner' && (await repo.countOwners(tx)) <= 1) {
				throw new UserFacingError('role', 'The nursery needs at least one owner: make someone else owner first', 409);
			}
			await repo.updateUser(input.userId, { role: input.role }, tx);
		});
		// A changed role must not linger in old sessions of that person.
		if (input.userId !== actingUserId) await endAllSessions(input.userId);
	},

	listTeamPage: (limit: number, offset: number) => repo.listUsers(limit, offset),
	countTeam: () => repo.countUsers(),
	async countByRole(): Promise<Record<Role, number>> {
		const counts: Record<Role, number> = { owner: 0, staff: 0, gardener: 0 };
		for (const row of await repo.countByRole()) counts[row.role] = row.n;
		return counts;
	},
	listOpenInvitations: (now = new Date()) => repo.listOpenInvitations(now)
};
