import { hash, verify } from '@node-rs/argon2';
import { availableParallelism } from 'node:os';

/** OWASP Password Storage Cheat Sheet: argon2id, m=19456 KiB, t=2, p=1. */
export const ARGON2_OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

/**
 * At most this many hashes run at once in this process (each holds 19 MiB and a core), whatever
 * the traffic. Checking a password at sign-in goes ahead of hashing a new one, so a flood of
 * sign-ups or resets cannot make people who are signing in wait behind it.
 */
export const HASHING_SLOTS = Math.max(1, availableParallelism());

export type HashingPriority = 'sign-in' | 'new-password';
const waiting: { priority: HashingPriority; start: () => void }[] = [];
let running = 0;
let started = 0;

/** Runs `work` in a hashing slot, queued by priority when every slot is busy (exported for its test). */
export async function inSlot<T>(priority: HashingPriority, work: () => Promise<T>): Promise<T> {
	if (running >= HASHING_SLOTS) {
		await new Promise<void>((start) => {
			const entry = { priority, start };
			// Sign-in checks queue ahead of every waiting new-password hash, in arrival order among themselves.
			const at = priority === 'sign-in' ? waiting.findIndex((w) => w.priority !== 'sign-in') : -1;
			if (at === -1) waiting.push(entry);
			else waiting.splice(at, 0, entry);
		});
	} else running++;
	started++;
	try {
		return await work();
	} finally {
		const next = waiting.shift();
		if (next) next.start();
		else running--;
	}
}

/** Hashes (and hashes waiting for a slot) right now: for tests and the benchmark. */
export const hashingLoad = () => ({ running, waiting: waiting.length, started });

export function hashPassword(password: string): Promise<string> {
	return inSlot('new-password', () => hash(password, { ...ARGON2_OPTIONS, algorithm: 2 /* Algorithm.Argon2id */ }));
}

export async function verifyPassword(hashed: string, password: string): Promise<boolean> {
	return inSlot('sign-in', async () => {
		try {
			return await verify(hashed, password);
		} catch {
			return false;
		}
	});
}

/** Spent by the sign-in path when no account matches, so timing does not reveal which e-mails exist. */
let dummyHash: Promise<string> | undefined;
export async function burnPasswordCheck(password: string): Promise<void> {
	dummyHash ??= hash('not-a-real-password-000', { ...ARGON2_OPTIONS, algorithm: 2 });
	await verifyPassword(await dummyHash, password);
}
