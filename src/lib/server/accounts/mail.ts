/**
 * Account e-mail, sent by the worker (scripts/worker.ts) from the account-mail queue, never inside
 * a request: a request that asks for mail answers the same way, in the same time, whether or not
 * an account uses the address (ASVS 6.3.8). Each job mints its own link, so no secret waits in
 * the queue's table.
 */
import { hashToken, newToken } from '../auth';
import { absoluteUrl, sendMail, type Message } from '../mail';
import { nurseryService } from '../nursery/service';
import { roleInSentence } from '../../schema/auth';
import { accountsRepository as repo, type TokenPurpose, type UserRow } from './repository';

const HOUR = 60 * 60 * 1000;
export const TOKEN_LIFETIME_MS = { 'verify-email': 48 * HOUR, 'reset-password': 1 * HOUR, invite: 7 * 24 * HOUR } as const;

export type AccountMailJob =
	/** Confirm a new account's address. */
	| { kind: 'verify-email'; userId: number }
	/** Someone asked for a new confirmation link for this address. */
	| { kind: 'resend-verification'; email: string }
	/** Someone tried to open an account with an address that already has one. */
	| { kind: 'already-registered'; email: string }
	| { kind: 'password-reset'; email: string }
	| { kind: 'invitation'; invitationId: number };

async function issueToken(userId: number, purpose: TokenPurpose, now: Date): Promise<string> {
	const token = newToken();
	await repo.insertToken({ userId, purpose, tokenHash: hashToken(token), expiresAt: new Date(now.getTime() + TOKEN_LIFETIME_MS[purpose]) });
	return token;
}

const verificationMail = (user: Pick<UserRow, 'email' | 'name'>, token: string): Message => ({
	to: user.email,
	subject: 'Confirm your e-mail for Bunchline',
	text: `Hello ${user.name},\n\nConfirm your e-mail address to start using your care plans:\n\n${absoluteUrl(`/verify?token=${token}`)}\n\nThe link works once and expires in 48 hours. If you did not sign up, ignore this message.\n\nBunchline`
});

/** Builds the message a job sends, or null when there is nothing to send (no such account, already confirmed…). */
export async function composeAccountMail(job: AccountMailJob, now = new Date()): Promise<Message | null> {
	switch (job.kind) {
		case 'verify-email': {
			const user = await repo.findById(job.userId);
			if (!user || user.emailVerifiedAt) return null;
			return verificationMail(user, await issueToken(user.id, 'verify-email', now));
		}
		case 'resend-verification': {
			const user = await repo.findByEmail(job.email);
			if (!user || user.emailVerifiedAt) return null;
			return verificationMail(user, await issueToken(user.id, 'verify-email', now));
		}
		case 'already-registered': {
			const user = await repo.findByEmail(job.email);
			if (!user) return null;
			if (!user.emailVerifiedAt) return verificationMail(user, await issueToken(user.id, 'verify-email', now));
			return {
				to: user.email,
				subject: 'Someone tried to open a Bunchline account with your e-mail',
				text: `Hello ${user.name},\n\nSomeone — perhaps you — tried to create a new Bunchline account with this e-mail address, which already has one. Nothing was changed.\n\nTo sign in: ${absoluteUrl('/login')}\nForgot your password? ${absoluteUrl('/reset')}\n\nIf it was not you, you can ignore this message.\n\nBunchline`
			};
		}
		case 'password-reset': {
			const user = await repo.findByEmail(job.email);
			if (!user) return null;
			const token = await issueToken(user.id, 'reset-password', now);
			return {
				to: user.email,
				subject: 'Reset your Bunchline password',
				text: `Hello ${user.name},\n\nChoose a new password here:\n\n${absoluteUrl(`/reset?token=${token}`)}\n\nThe link works once and expires in 1 hour. If you did not ask for it, ignore this message: your password stays as it is.\n\nBunchline`
			};
		}
		case 'invitation': {
			const invitation = await repo.findInvitationById(job.invitationId);
			if (!invitation) return null;
			const token = newToken();
			// Replaced or accepted while the job waited: that link must not be sent.
			if (!(await repo.setInvitationToken(invitation.id, hashToken(token)))) return null;
			const [inviter, nursery] = await Promise.all([repo.findById(invitation.invitedBy), nurseryService.publicProfile()]);
			const from = inviter ? `${inviter.name} (${inviter.email})` : 'The owner';
			return {
				to: invitation.email,
				subject: `${inviter?.name ?? 'The owner'} invites you to ${nursery.name} on Bunchline`,
				text: `Hello,\n\n${from} invites you to join the team of ${nursery.name} on Bunchline as ${roleInSentence(invitation.role)}.\nSet your name and password here:\n\n${absoluteUrl(`/signup?invite=${token}`)}\n\nThe link works once and expires in 7 days. A newer invitation to this address replaces it.\nIf you do not know ${nursery.name}, ignore this message.\n\nBunchline`
			};
		}
	}
}

/** The worker's handler: compose, then send. A mail server that is down fails the job, and the queue retries it. */
export async function runAccountMailJob(job: AccountMailJob, send: (m: Message) => Promise<unknown> = sendMail): Promise<void> {
	const message = await composeAccountMail(job);
	if (message) await send(message);
}
