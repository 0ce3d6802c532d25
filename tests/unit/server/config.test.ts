import { afterEach, describe, expect, it, vi } from 'vitest';

async function configUnder(env: Record<string, string | undefined>) {
	vi.resetModules();
	for (const [k, v] of Object.entries(env)) vi.stubEnv(k, v as string);
	return (await import('../../../src/lib/server/config')).config;
}

afterEach(() => vi.unstubAllEnvs());

describe('modes', () => {
	it('production: Secure cookies and no developer mailbox', async () => {
		const c = await configUnder({ BUNCHLINE_ENV: 'production' });
		expect(c.secureCookies).toBe(true);
		expect(c.devMailbox).toBe(false);
	});
	it('NODE_ENV=production alone also means production', async () => {
		const c = await configUnder({ BUNCHLINE_ENV: undefined, NODE_ENV: 'production' });
		expect(c.mode).toBe('production');
		expect(c.devMailbox).toBe(false);
	});
	it('the demo started by npm start keeps the mailbox for the owner', async () => {
		const c = await configUnder({ BUNCHLINE_ENV: 'demo' });
		expect(c.devMailbox).toBe(true);
		expect(c.secureCookies).toBe(false);
	});
});
