/**
 * Claim codes. A plant's code is an HMAC of its id and claim version under the server's claim
 * key, so a printed card can show it again later while only its hash is stored; reissuing bumps
 * the version, which changes the code and retires the old one.
 */
import { createHmac } from 'node:crypto';
import { encodeBase32LowerCaseNoPadding } from '@oslojs/encoding';
import { hashToken } from '../auth/tokens';

/** 20 bytes of the MAC: 160 bits, the same length and alphabet as every e-mailed token. */
const CODE_BYTES = 20;

export function claimCode(secret: string, plantId: number, claimVersion: number): string {
	const mac = createHmac('sha256', secret).update(`bunchline-claim:${plantId}:${claimVersion}`).digest();
	return encodeBase32LowerCaseNoPadding(mac.subarray(0, CODE_BYTES));
}

/** What the plants table stores: the code's SHA-256, never the code. */
export const claimCodeHash = (code: string) => hashToken(code);

export const claimPath = (code: string) => `/claim/${code}`;
