import { describe, expect, it } from 'vitest';
import { assertClaimSecret } from '../../../src/lib/server/secrets';

describe('the claim-code key', () => {
	it('is required in production', () => {
		expect(() => assertClaimSecret({ mode: 'production', claimSecret: null })).toThrow(/CLAIM_SECRET/);
		expect(() => assertClaimSecret({ mode: 'production', claimSecret: 'x'.repeat(32) })).not.toThrow();
	});
	it('refuses a short key in any mode', () => {
		expect(() => assertClaimSecret({ mode: 'demo', claimSecret: 'short' })).toThrow(/32/);
	});
	it('may be left to the database outside production', () => {
		expect(() => assertClaimSecret({ mode: 'demo', claimSecret: null })).not.toThrow();
		expect(() => assertClaimSecret({ mode: 'test', claimSecret: null })).not.toThrow();
	});
});
