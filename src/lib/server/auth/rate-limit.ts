import { attemptsRepository as repo } from './attempts-repository';

const MINUTE = 60 * 1000;

export interface Limit {
	limit: number;
	windowMs: number;
}

/**
 * Counted in PostgreSQL so every app instance shares them. Hard limits (429) only ever fall on the
 * requester's own address or session; what an account suffers from strangers is a delay, never a
 * refusal (see signInDelayMs), and mail limits are counted on the address typed, whether or not an
 * account uses it, so a refusal reveals nothing.
 */
export const LIMITS = {
	/** Sign-in attempts from one address (password spraying). */
	signInPerAddress: { limit: 30, windowMs: 15 * MINUTE },
	/** Failed sign-ins on one account before each new attempt is slowed down. */
	signInFreeFailures: { limit: 5, windowMs: 15 * MINUTE },
	/** Links e-mailed to one address, whoever asks (inbox flooding). */
	mailsPerAddressee: { limit: 10, windowMs: 60 * MINUTE },
	/** Links one requester may have sent to one address: a stranger uses up their own share, not the owner's. */
	mailsPerRequesterAndAddressee: { limit: 3, windowMs: 60 * MINUTE },
	/** Sign-ups, invitation acceptances, resets and password changes from one address: each costs a 19 MiB hash. */
	newPasswordsPerAddress: { limit: 20, windowMs: 60 * MINUTE },
	/** Current-password checks for one signed-in account (a stolen session guessing the password). */
	currentPasswordChecksPerAccount: { limit: 5, windowMs: 15 * MINUTE }
} as const satisfies Record<string, Limit>;

/** The slow-down grows with failures: nothing for the first five, then 0.25 s doubling up to 5 s. */
export const SIGN_IN_DELAY = { firstMs: 250, maxMs: 5000 } as const;

export function signInDelayMs(recentFailures: number): number {
	const over = recentFailures - LIMITS.signInFreeFailures.limit;
	return over < 0 ? 0 : Math.min(SIGN_IN_DELAY.maxMs, SIGN_IN_DELAY.firstMs * 2 ** over);
}

export const keys = {
	signInFailures: (email: string) => `email:${email}`,
	signInAddress: (ip: string) => `ip:${ip}`,
	mailTo: (email: string) => `mail:${email}`,
	mailFromTo: (ip: string, email: string) => `mail:${ip}:${email}`,
	newPassword: (ip: string) => `new-password:${ip}`,
	currentPassword: (userId: number) => `current-password:${userId}`
};

const KEEP_ROWS_MS = 24 * 60 * MINUTE;

export interface Attempt {
	allowed: boolean;
	id: number;
}

/**
 * Records the attempt first and only then counts, so requests racing in parallel each see the
 * others: at most `limit` of them get through, however many arrive at once.
 */
export async function consume(key: string, rule: Limit, now = new Date()): Promise<Attempt> {
	const id = await repo.insert(key);
	const n = await repo.countSince(key, new Date(now.getTime() - rule.windowMs));
	// Old rows are useless; trimming here keeps the table small without a separate job.
	await repo.deleteBefore(new Date(now.getTime() - KEEP_ROWS_MS));
	return { allowed: n <= rule.limit, id };
}

/** Takes back recorded attempts (a refused request must not use up a share it never got to use). */
export const release = (attempts: Attempt[]) => repo.deleteIds(attempts.map((a) => a.id));

/** Consumes every rule or none: a request refused by one limit leaves the others' counts as they were. */
export async function consumeAll(rules: [string, Limit][], now = new Date()): Promise<boolean> {
	const attempts = await Promise.all(rules.map(([key, rule]) => consume(key, rule, now)));
	if (attempts.every((a) => a.allowed)) return true;
	await release(attempts);
	return false;
}

/** Failed sign-ins on the account within the window. */
export const recentSignInFailures = (email: string, now = new Date()) =>
	repo.countSince(keys.signInFailures(email), new Date(now.getTime() - LIMITS.signInFreeFailures.windowMs));

export const recordSignInFailure = (email: string) => repo.insert(keys.signInFailures(email));

export const clearSignInFailures = (email: string) => repo.deleteKey(keys.signInFailures(email));
