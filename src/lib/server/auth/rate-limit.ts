import { attemptsRepository as repo } from './attempts-repository';

const MINUTE = 60 * 1000;

export interface Limit {
	limit: number;
	windowMs: number;
}

/**
 * Failed sign-ins per e-mail (guessing one account) and per address (spraying many), mails to one
 * address (inbox flooding) and sign-ups per address. Counted in PostgreSQL so every instance shares them.
 */
export const LIMITS = {
	signInPerEmail: { limit: 5, windowMs: 15 * MINUTE },
	signInPerAddress: { limit: 30, windowMs: 15 * MINUTE },
	mailsPerAddressee: { limit: 5, windowMs: 60 * MINUTE },
	signUpsPerAddress: { limit: 20, windowMs: 60 * MINUTE }
} as const satisfies Record<string, Limit>;

export const SIGN_IN_LIMITS = { email: LIMITS.signInPerEmail.limit, ip: LIMITS.signInPerAddress.limit } as const;

export const keys = {
	signInEmail: (email: string) => `email:${email}`,
	signInAddress: (ip: string) => `ip:${ip}`,
	mailTo: (email: string) => `mail:${email}`,
	signUpAddress: (ip: string) => `signup-ip:${ip}`
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

/** A successful sign-in: its own attempts do not count, and earlier failures on the account are forgiven. */
export async function forgive(attempts: Attempt[], email: string): Promise<void> {
	await repo.deleteIds(attempts.map((a) => a.id));
	await repo.deleteKey(keys.signInEmail(email));
}

export const clearSignInFailures = (email: string) => repo.deleteKey(keys.signInEmail(email));
