import { hmac } from '@oslojs/crypto/hmac';
import { SHA256 } from '@oslojs/crypto/sha2';
import { encodeBase32LowerCaseNoPadding } from '@oslojs/encoding';
import { describe, expect, it } from 'vitest';
import { claimCode, claimCodeHash } from '../../../src/lib/server/plants/claim-code';
import { CLAIM_CODE } from '../../../src/lib/schema/stock';

const secret = 'k'.repeat(40);

describe('claim codes', () => {
	it('are the first 160 bits of HMAC-SHA256 of the plant and version (checked with @oslojs/crypto’s HMAC)', () => {
		const mac = hmac(SHA256, new TextEncoder().encode(secret), new TextEncoder().encode('bunchline-claim:42:1'));
		expect(claimCode(secret, 42, 1)).toBe(encodeBase32LowerCaseNoPadding(mac.slice(0, 20)));
		// 32 base32 characters carry 5 bits each: 160 bits, above the 80 required.
		expect(claimCode(secret, 42, 1)).toMatch(CLAIM_CODE);
	});
	it('change with the plant, the version and the key', () => {
		const codes = new Set([claimCode(secret, 42, 1), claimCode(secret, 43, 1), claimCode(secret, 42, 2), claimCode('z'.repeat(40), 42, 1)]);
		expect(codes.size).toBe(4);
	});
	it('are stored only as a SHA-256 hash', () => {
		const code = claimCode(secret, 7, 1);
		expect(claimCodeHash(code)).toMatch(/^[0-9a-f]{64}$/);
		expect(claimCodeHash(code)).not.toContain(code);
	});
});
