import { hash, verify } from '@node-rs/argon2';

/** OWASP Password Storage Cheat Sheet: argon2id, m=19456 KiB, t=2, p=1. */
export const ARGON2_OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export function hashPassword(password: string): Promise<string> {
	return hash(password, { ...ARGON2_OPTIONS, algorithm: 2 /* Algorithm.Argon2id */ });
}

export async function verifyPassword(hashed: string, password: string): Promise<boolean> {
	try {
		return await verify(hashed, password);
	} catch {
		return false;
	}
}

/** Spent by the sign-in path when no account matches, so timing does not reveal which e-mails exist. */
let dummyHash: Promise<string> | undefined;
export async function burnPasswordCheck(password: string): Promise<void> {
	dummyHash ??= hashPassword('not-a-real-password-000');
	await verifyPassword(await dummyHash, password);
}
