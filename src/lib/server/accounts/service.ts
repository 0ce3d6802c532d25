import {
	burnPasswordCheck,
	clearSignInFailures,
	consume,
	consumeAll,
	endAllSessions,
	endOtherSessions,
	hashPassword,
	hashToken,
	LIMITS,
	limitKeys,
	newToken,
	recentSignInFailures,
	recordSignInFailure,
	release,
	signInDelayMs,
	verifyPassword
} from '../auth';
import { UserFacingError } from '../errors';
import { enqueue, QUEUES } from '../jobs';
import { nurseryService } from '../nursery/service';
import { assessPassword, contextWords } from '../../password-strength';
import { roleInSentence, type Role, type TeamRole } from '../../schema/auth';
import { TOKEN_LIFETIME_MS, type AccountMailJob } from './mail';
import { accountsRepository as repo } from './repository';

export { TOKEN_LIFETIME_MS };

/** The demo password is printed in the README: never acceptable as a real one. */
const PUBLISHED_PASSWORDS = ['ripe-gold-2026'];

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export interface AccountDeps {
	/** How the sign-in slow-down waits; tests pass a recorder. */
	wait?: (ms: number) => Promise<void>;
	now?: Date;
}

const queueMail = (job: AccountMailJob) => enqueue(QUEUES.accountMail, job);

/** Refuses a guessable new password, beside the field, with what to change (ASVS 6.2.4). */
async function requireStrongPassword(password: string, context: (string | null | undefined)[]): Promise<void> {
	const nursery = await nurseryService.publicProfile();
	const { acceptable, advice } = assessPassword(password, contextWords([...context, nursery.name, nursery.town, ...PUBLISHED_PASSWORDS]));
	if (!acceptable) throw new UserFacingError('password', `This password is too easy to guess. ${advice}`);
}

/** Every action that hashes a new password counts against the requester's address first (ASVS 6.3.1). */
async function takeHashingShare(ip: string): Promise<void> {
	if (!(await consume(limitKeys.newPassword(ip), LIMITS.newPasswordsPerAddress)).allowed) {
		throw new UserFacingError('form', 'Too many new passwords from this connection in the last hour: try again later', 429);
	}
}

/**
 * Links e-mailed on request are limited per address typed and per requester, counted whether or
 * not an account uses the address: the answer says honestly that no mail was sent, and still
 * reveals nothing. A stranger uses up their own share for that address, not its owner's.
 */
async function takeMailShare(email: string, ip: string): Promise<void> {
	const ok = await consumeAll([
		[limitKeys.mailFromTo(ip, email), LIMITS.mailsPerRequesterAndAddressee],
		[limitKeys.mailTo(email), LIMITS.mailsPerAddressee]
	]);
	if (!ok) {
		throw new UserFacingError('email', 'We sent several links to this address in the last hour, so we did not send another: use the newest one, or try again in an hour', 429);
	}
}

export type InvitationState = 'live' | 'used' | 'replaced' | 'expired' | 'unknown';

export const INVITATION_STATE_TEXT: Record<Exclude<InvitationState, 'live'>, string> = {
	used: 'This invitation was already used to join the team: sign in with the password chosen then.',
	replaced: 'A newer invitation was sent to this address after this one: use the link in the newest e-mail.',
	expired: 'This invitation is more than 7 days old: ask the owner for a new one.',
	unknown: 'This invitation link is not valid: check that the whole link was copied, or ask the owner for a new one.'
};

export const accounts = {
	/**
	 * Always "check your e-mail": a new address gets its confirmation link, an address that has an
	 * account gets a note saying so (ASVS 6.3.8). The password is hashed either way, so the time
	 * taken does not tell the two apart.
	 */
	async signUp(input: { name: string; email: string; password: string }, ip: string) {
		await takeHashingShare(ip);
		await requireStrongPassword(input.password, [input.email, input.name]);
		const passwordHash = await hashPassword(input.password);
		const created = await repo.insertUser({ name: input.name, email: input.email, passwordHash, role: 'gardener' });
		await queueMail(created ? { kind: 'verify-email', userId: created.id } : { kind: 'already-registered', email: input.email });
		return { email: input.email };
	},

	async resendVerification(email: string, ip: string) {
		await takeMailShare(email, ip);
		await queueMail({ kind: 'resend-verification', email });
	},

	async verifyEmail(token: string, now = new Date()) {
		return repo.transaction(async (tx) => {
			const row = await repo.consumeToken(hashToken(token), 'verify-email', now, tx);
			if (!row) throw new UserFacingError('token', 'This link has expired or was already used: sign in to get a new one', 410);
			await repo.updateUser(row.userId, { emailVerifiedAt: now }, tx);
			return row.userId;
		});
	},

	/**
	 * Limited per address (hard, 429: that is the requester's own connection). Failures on the
	 * account only slow its next attempts down, so a stranger's guesses can never refuse the
	 * owner's correct password (ASVS 6.3.1, 6.3.5); guesses refused by the address limit are not
	 * counted against the account.
	 */
	async signIn(input: { email: string; password: string }, ip: string, deps: AccountDeps = {}) {
		const fromAddress = await consume(limitKeys.signInAddress(ip), LIMITS.signInPerAddress);
		if (!fromAddress.allowed) {
			throw new UserFacingError('form', 'Too many sign-in attempts from this connection: wait 15 minutes, or reset your password', 429);
		}
		await (deps.wait ?? sleep)(signInDelayMs(await recentSignInFailures(input.email)));
		const user = await repo.findByEmail(input.email);
		const ok = user ? await verifyPassword(user.passwordHash, input.password) : (await burnPasswordCheck(input.password), false);
		if (!user || !ok) {
			await recordSignInFailure(input.email);
			throw new UserFacingError('password', 'That e-mail and password do not match', 400);
		}
		// A correct password does not use up the connection's share, and forgives the account's failures.
		await Promise.all([release([fromAddress]), clearSignInFailures(input.email)]);
		if (!user.emailVerifiedAt) {
			throw new UserFacingError('email', 'Confirm your e-mail first: we sent you a link (you can ask for a new one below)', 403);
		}
		return user;
	},

	/** Looks the same from outside whether or not the account exists: same answer, same work. */
	async requestPasswordReset(email: string, ip: string) {
		await takeMailShare(email, ip);
		await queueMail({ kind: 'password-reset', email });
	},

	/** Whether a reset link still works, checked before the page asks for a new password. */
	async resetLinkIsLive(token: string, now = new Date()) {
		return (await repo.findLiveToken(hashToken(token), 'reset-password', now)) !== undefined;
	},

	/** The token is checked before anything costly: a made-up token costs one indexed read (ASVS 6.3.1). */
	async resetPassword(input: { token: string; password: string }, ip: string, now = new Date()) {
		const live = await repo.findLiveToken(hashToken(input.token), 'reset-password', now);
		if (!live) throw new UserFacingError('token', 'This link has expired or was already used: request a new one', 410);
		await takeHashingShare(ip);
		const owner = await repo.findById(live.userId);
		await requireStrongPassword(input.password, [owner?.email, owner?.name]);
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

	/** Signed in, with the current password: every other session ends (ASVS 6.2.2, 6.2.3). */
	async changePassword(input: { currentPassword: string; password: string }, me: { id: number; sessionId: string }, ip: string) {
		if (!(await consume(limitKeys.currentPassword(me.id), LIMITS.currentPasswordChecksPerAccount)).allowed) {
			throw new UserFacingError('currentPassword', 'Too many tries: wait 15 minutes, or sign out and reset your password', 429);
		}
		const user = await repo.findById(me.id);
		if (!user || !(await verifyPassword(user.passwordHash, input.currentPassword))) {
			throw new UserFacingError('currentPassword', 'That is not your current password');
		}
		if (input.password === input.currentPassword) throw new UserFacingError('password', 'Choose a password different from the current one');
		await takeHashingShare(ip);
		await requireStrongPassword(input.password, [user.email, user.name]);
		await repo.updateUser(user.id, { passwordHash: await hashPassword(input.password) });
		await endOtherSessions(user.id, me.sessionId);
	},

	/** A new invitation to an address replaces the one still pending there. */
	async invite(input: { email: string; role: TeamRole }, invitedBy: number, now = new Date()) {
		const existing = await repo.findByEmail(input.email);
		// A gardener (a buyer) may join the team; someone on it already changes role in the list.
		if (existing?.emailVerifiedAt && existing.role !== 'gardener') {
			throw new UserFacingError('email', `${existing.name} is already on the team as ${roleInSentence(existing.role)}: change the role in the list`, 409);
		}
		if (!(await consume(limitKeys.mailTo(input.email), LIMITS.mailsPerAddressee)).allowed) {
			throw new UserFacingError('email', 'Too many messages to this address in the last hour: try again later', 429);
		}
		const invitation = await repo.replaceInvitation(
			// A random hash no link matches yet: the mail job mints the real link.
			{ email: input.email, role: input.role, tokenHash: hashToken(newToken()), invitedBy, expiresAt: new Date(now.getTime() + TOKEN_LIFETIME_MS.invite) },
			now
		);
		await queueMail({ kind: 'invitation', invitationId: invitation.id });
	},

	/** What an invitation link is: live (with its address and role), or why it no longer works. */
	async invitationState(token: string, now = new Date()): Promise<{ state: 'live'; email: string; role: Role } | { state: Exclude<InvitationState, 'live'> }> {
		const inv = await repo.findInvitation(hashToken(token));
		if (!inv) return { state: 'unknown' };
		if (inv.acceptedAt) return { state: 'used' };
		if (inv.replacedAt) return { state: 'replaced' };
		if (inv.expiresAt <= now) return { state: 'expired' };
		return { state: 'live', email: inv.email, role: inv.role };
	},

	/** The invitation is checked before the password is hashed; the link proves the inbox, like a reset. */
	async acceptInvitation(input: { token: string; name: string; password: string }, ip: string, now = new Date()) {
		const found = await this.invitationState(input.token, now);
		if (found.state !== 'live') throw new UserFacingError('token', INVITATION_STATE_TEXT[found.state], 410);
		await takeHashingShare(ip);
		await requireStrongPassword(input.password, [found.email, input.name]);
		const passwordHash = await hashPassword(input.password);
		const user = await repo.transaction(async (tx) => {
			const inv = await repo.findInvitation(hashToken(input.token), tx);
			if (!inv || !(await repo.markInvitationAccepted(inv.id, now, tx))) throw new UserFacingError('token', INVITATION_STATE_TEXT.used, 410);
			const existing = await repo.findByEmail(inv.email, tx);
			if (existing?.emailVerifiedAt && existing.role !== 'gardener') throw new UserFacingError('email', 'An account with this e-mail is already on the team: sign in instead', 409);
			const values = { name: input.name, passwordHash, role: inv.role, emailVerifiedAt: now };
			if (existing) await repo.updateUser(existing.id, values, tx);
			const user = existing ? { ...existing, ...values } : await repo.insertUser({ email: inv.email, ...values }, tx);
			return user!;
		});
		// Whoever held a session of an earlier account at this address is signed out of it.
		await endAllSessions(user.id);
		return user;
	},

	/** Only an owner changes roles (the route's guard), and the last owner cannot step down. */
	async changeRole(input: { userId: number; role: Role }, actingUserId: number) {
		const person = await repo.transaction(async (tx) => {
			const target = await repo.findById(input.userId, tx);
			if (!target) throw new UserFacingError('userId', 'No such person', 404);
			if (target.role === 'owner' && input.role !== 'owner' && (await repo.lockOwners(tx)).length <= 1) {
				throw new UserFacingError('role', `${target.name} is the only owner: make someone else owner first`, 409);
			}
			await repo.updateUser(input.userId, { role: input.role }, tx);
			return target;
		});
		// A changed role must not linger in old sessions of that person.
		if (input.userId !== actingUserId) await endAllSessions(input.userId);
		return { name: person.name, role: input.role, self: input.userId === actingUserId };
	},

	findPerson: (id: number) => repo.findById(id),
	listTeamPage: (limit: number, offset: number) => repo.listTeam(limit, offset),
	countTeam: () => repo.countTeam(),
	async countByRole(): Promise<Record<Role, number>> {
		const counts: Record<Role, number> = { owner: 0, staff: 0, gardener: 0 };
		for (const row of await repo.countByRole()) counts[row.role] = row.n;
		return counts;
	},
	listOpenInvitations: (now = new Date()) => repo.listOpenInvitations(now)
};
