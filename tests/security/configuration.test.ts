// Configuration that fails closed (ASVS 13.1, 3.3.1): a mode or value that is not understood stops
// the app and the scripts; production means Secure, __Host- cookies and no developer mailbox.
import { spawnSync } from 'node:child_process';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { DEFAULTS, EnvironmentError, localDatabaseUrl, parseEnvironment } from '../../src/lib/server/env.js';

async function configUnder(env: Record<string, string | undefined>) {
	vi.resetModules();
	for (const [k, v] of Object.entries(env)) vi.stubEnv(k, v as string);
	return (await import('../../src/lib/server/config')).config;
}

afterEach(() => vi.unstubAllEnvs());

describe('ASVS 13.1 the environment is parsed once, and an unknown value refuses to start', () => {
	for (const mode of ['Production', 'prod', 'PRODUCTION', 'production ', 'dev', 'Demo']) {
		it(`BUNCHLINE_ENV=${JSON.stringify(mode)} is refused`, () => {
			expect(() => parseEnvironment({ BUNCHLINE_ENV: mode })).toThrow(EnvironmentError);
			expect(() => parseEnvironment({ BUNCHLINE_ENV: mode })).toThrow(/BUNCHLINE_ENV/);
		});
	}
	it('mistyped ports and origins are refused and named', () => {
		expect(() => parseEnvironment({ PORT: '80a' })).toThrow(/PORT/);
		expect(() => parseEnvironment({ BUNCHLINE_PG_PORT: '70000' })).toThrow(/BUNCHLINE_PG_PORT/);
		expect(() => parseEnvironment({ ORIGIN: 'plants.example.org' })).toThrow(/ORIGIN/);
		expect(() => parseEnvironment({ DATABASE_URL: 'mysql://x' })).toThrow(/DATABASE_URL/);
	});
	it('the default database URL and port come from one place', () => {
		const env = parseEnvironment({});
		expect(env.databaseUrl).toBe(localDatabaseUrl(DEFAULTS.pgPort));
		expect(parseEnvironment({ BUNCHLINE_PG_PORT: '55555' }).databaseUrl).toContain(':55555/');
	});
	it('npm start refuses a mistyped mode before starting anything', () => {
		const r = spawnSync('node', ['scripts/start.mjs'], { env: { ...process.env, BUNCHLINE_ENV: 'Production', DATABASE_URL: '' }, encoding: 'utf8', timeout: 20_000 });
		expect(r.status).toBe(1);
		expect(r.stderr).toMatch(/BUNCHLINE_ENV must be one of/);
		expect(r.stdout).not.toMatch(/Starting PostgreSQL/);
	});
	it('the worker and the seed refuse it too', () => {
		for (const script of ['scripts/worker.ts', 'scripts/seed.ts']) {
			const r = spawnSync('node', ['--import', 'tsx', script], { env: { ...process.env, BUNCHLINE_ENV: 'prod' }, encoding: 'utf8', timeout: 30_000 });
			expect(r.status, script).toBe(1);
			expect(r.stderr, script).toMatch(/BUNCHLINE_ENV/);
		}
	});
});

describe('ASVS 3.3.1 modes', () => {
	it('production: Secure cookies with the __Host- prefix and no developer mailbox', async () => {
		const c = await configUnder({ BUNCHLINE_ENV: 'production', ORIGIN: 'https://plants.example.org' });
		expect(c.secureCookies).toBe(true);
		expect(c.devMailbox).toBe(false);
		const { SESSION_COOKIE } = await import('../../src/lib/server/auth/lucia');
		expect(SESSION_COOKIE).toBe('__Host-bunchline_session');
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
	it('a capitalised mode cannot turn the developer mailbox on: the app refuses to load', async () => {
		await expect(configUnder({ BUNCHLINE_ENV: 'Production' })).rejects.toThrow(/BUNCHLINE_ENV/);
	});
});
