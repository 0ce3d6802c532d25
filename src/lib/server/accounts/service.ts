import {
	burnPasswordCheck,
	clearSignInFailures,
	consume,
	endAllSessions,
	forgive,
	hashPassword,
	hashToken,
	LIMITS,
	limitKeys,
	newToken,
	verifyPassword
} from '../auth';
import { UserFacingError } from '../errors';
import { absoluteUrl, sendMail, type Message } from '../mail';
import type { Role } from '../../schema/auth';
import { accountsRepository as repo, type UserRow } from './repository';

const HOUR = 60 * 60 * 1000;
export const TOKEN_LIFETIME_MS = { 'verify-email': 48 * HOUR, 'reset-password': 1 * HOUR, invite: 7 * 24 * HOUR } as const;

type Tx = Parameters<Parameters<typeof repo.transaction>[0]>[0];

async function issueToken(userId: number, purpose: 'verify-email' | 'reset-password', now: Date, tx?: Tx) {
	const token = newToken();
	await repo.insertToken({ userId, purpose, tokenHash: hashToken(token), expiresAt: new Date(now.getTime() + TOKEN_LIFETIME_MS[purpose]) }, tx);
	return token;
}

/**
 * Sends after the rows are committed; a mail server that is down becomes a 503 the person can
 * act on. Mails to one address are limited, so no form can be used to flood an inbox.
 */
async function deliver(m: Message, whenRefused: 'silently' | 'loudly', afterFailure: string): Promise<void> {
	const { allowed } = await consume(limitKeys.mailTo(m.to), LIMITS.mailsPerAddressee);
	if (!allowed) {
		if (whenRefused === 'silently') return;
		throw new UserFacingError('email', 'Too many messages to this address in the last hour: try again later', 429);
	}
	try {
		await sendMail(m);
	} catch {
		throw new UserFacingError('form', afterFailure, 503);
	}
}

/** The confirmation link; `next` (a same-site path, checked by the caller) is where sign-in leads after. */
const verifyLink = (token: string, next?: string) => absoluteUrl(`/verify?token=${token}${next ? `&next=${encodeURIComponent(next)}` : ''}`);

const verificationMail = (user: Pick<UserRow, 'email' | 'name'>, token: string, next?: string): Message => ({
	to: user.email,
	subject: 'Confirm your e-mail for Bunchline',
	text: `Hello ${user.name},\n\nConfirm your e-mail address to start using your care plans:\n\n${verifyLink(token, next)}\n\nThe link works once and expires in 48 hours. If you did not sign up, ignore this message.\n\nBunchline`
});

const RESEND_HINT = 'ask for a new confirmation link from the sign-in page in a few minutes';

export const accounts = {
	async signUp(input: { name: string; email: string; password: string }, ip: string, now = new Date(), next?: string) {
		if (!(await consume(limitKeys.signUpAddress(ip), LIMITS.signUpsPerAddress)).allowed) {
			throw new UserFacingError('form', 'Too many new accounts from this connection: try again in an hour', 429);
		}
		const passwordHash = await hashPassword(input.password);
		const { user, token } = await repo.transaction(async (tx) => {
			const user = await repo.insertUser({ name: input.name, email: input.email, passwordHash, role: 'gardener' }, tx);
			if (!user) throw new UserFacingError('email', 'An account with this e-mail already exists: sign in or reset your password', 409);
			return { user, token: await issueToken(user.id, 'verify-email', now, tx) };
		});
		await deliver(verificationMail(user, token, next), 'loudly', `Your account is created, but the confirmation e-mail could not be sent: ${RESEND_HINT}`);
		return user;
	},

	async resendVerification(email: string, now = new Date()) {
		const user = await repo.findByEmail(email);
		if (!user || user.emailVerifiedAt) return;
		const token = await issueToken(user.id, 'verify-email', now);
		await deliver(verificationMail(user, token), 'silently', `The e-mail could not be sent just now: ${RESEND_HINT}`);
	},

	async verifyEmail(token: string, now = new Date()) {
		return repo.transaction(async (tx) => {
			const row = await repo.consumeToken(hashToken(token), 'verify-email', now, tx);
			if (!row) throw new UserFacingError('token', 'This link has expired or was already used: sign in to get a new one', 410);
			await repo.updateUser(row.userId, { emailVerifiedAt: now }, tx);
			return row.userId;
		});
	},

	async signIn(input: { email: string; password: string }, ip: string) {
		const attempts = await Promise.all([
			consume(limitKeys.signInEmail(input.email), LIMITS.signInPerEmail),
			consume(limitKeys.signInAddress(ip), LIMITS.signInPerAddress)
		]);
		if (attempts.some((a) => !a.allowed)) {
			throw new UserFacingError('form', 'Too many attempts: wait 15 minutes, or reset your password', 429);
		}
		const user = await repo.findByEmail(input.email);
		const ok = user ? await verifyPassword(user.passwordHash, input.password) : (await burnPasswordCheck(input.password), false);
		if (!user || !ok) throw new UserFacingError('password', 'That e-mail and password do not match', 400);
		await forgive(attempts, input.email);
		if (!user.emailVerifiedAt) {
			throw new UserFacingError('email', 'Confirm your e-mail first: we sent you a link (you can ask for a new one below)', 403);
		}
		return user;
	},

	/** Always looks the same from outside, so it does not reveal who has an account. */
	async requestPasswordReset(email: string, now = new Date()) {
		const user = await repo.findByEmail(email);
		if (!user) return;
		const token = await issueToken(user.id, 'reset-password', now);
		await deliver(
			{
				to: user.email,
				subject: 'Reset your Bunchline password',
				text: `Hello ${user.name},\n\nChoose a new password here:\n\n${absoluteUrl(`/reset?token=${token}`)}\n\nThe link works once and expires in 1 hour. If you did not ask for it, ignore this message: your password stays as it is.\n\nBunchline`
			},
			'silently',
			'The e-mail could not be sent just now: try again in a few minutes'
		);
	},

	async resetPassword(input: { token: string; password: string }, now = new Date()) {
		const passwordHash = await hashPassword(input.password);
		const user = await repo.transaction(async (tx) => {
			const row = await repo.consumeToken(hashToken(input.token), 'reset-password', now, tx);
			if (!row) throw new UserFacingError('token', 'This link has expired or was already used: request a new one', 410);
			const user = (await repo.findById(row.userId, tx))!;
			// A reset proves control of the inbox, so it also confirms the address.
			await repo.updateUser(row.userId, { passwordHash, emailVerifiedAt: user.emailVerifiedAt ?? now }, tx);
			await repo.expireTokens(row.userId, 'reset-password', now, tx);
			return user;
		});
		await endAllSessions(user.id);
		await clearSignInFailures(user.email);
		return user.id;
	},

	async invite(input: { email: string; role: Role }, invitedBy: number, now = new Date()) {
		const existing = await repo.findByEmail(input.email);
		// An unconfirmed account may have been opened by someone else in that name: the invitation replaces it.
		if (existing?.emailVerifiedAt) {
			throw new UserFacingError('email', 'This person already has an account: change their role in the team list', 409);
		}
		const token = newToken();
		await repo.insertInvitation({ email: input.email, role: input.role, tokenHash: hashToken(token), invitedBy, expiresAt: new Date(now.getTime() + TOKEN_LIFETIME_MS.invite) });
		await deliver(
			{
				to: input.email,
				subject: 'You are invited to the Bunchline team',
				text: `Hello,\n\nYou are invited to join the nursery team on Bunchline as ${input.role}.\nSet your name and password here:\n\n${absoluteUrl(`/signup?invite=${token}`)}\n\nThe link works once and expires in 7 days.\n\nBunchline`
			},
			'loudly',
			'The invitation is saved but the e-mail could not be sent: try again in a few minutes'
		);
	},

	async findInvitation(token: string, now = new Date()) {
		return repo.findLiveInvitation(hashToken(token), now);
	},

	async acceptInvitation(input: { token: string; name: string; password: string }, now = new Date()) {
		const passwordHash = await hashPassword(input.password);
		const user = await repo.transaction(async (tx) => {
			const inv = await repo.findLiveInvitation(hashToken(input.token), now, tx);
			if (!inv) throw new UserFacingError('token', 'This invitation has expired or was already used: ask the owner for a new one', 410);
			const existing = await repo.findByEmail(inv.email, tx);
			if (existing?.emailVerifiedAt) throw new UserFacingError('email', 'An account with this e-mail already exists: sign in instead', 409);
			const values = { name: input.name, passwordHash, role: inv.role, emailVerifiedAt: now };
			if (existing) await repo.updateUser(existing.id, values, tx);
			const user = existing ? { ...existing, ...values } : await repo.insertUser({ email: inv.email, ...values }, tx);
			await repo.markInvitationAccepted(inv.id, now, tx);
			return user!;
		});
		// Whoever opened the unconfirmed account before is signed out of it.
		await endAllSessions(user.id);
		return user;
	},

	/** Only an owner changes roles (the route's guard), and the last owner cannot step down. */
	async changeRole(input: { userId: number; role: Role }, actingUserId: number) {
		await repo.transaction(async (tx) => {
			const target = await repo.findById(input.userId, tx);
			if (!target) throw new UserFacingError('userId', 'No such person', 404);
			if (target.role === 'owner' && input.role !== 'owner' && (await repo.lockOwners(tx)).length <= 1) {
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
