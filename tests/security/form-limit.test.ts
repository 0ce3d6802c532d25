// ASVS 2.4.1 (anti-automation): signed-out form submissions have a per-address budget, so a flood
// from one address is refused before it costs database work and queues other visitors' sign-ins
// behind it on the connection pool (bench/routes.mjs, bench/RESULTS.md "Public routes").
import { spawn } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formPostLimiter, tokenBucketLimiter } from '../../src/lib/server/api-limit';
import { testPorts } from '../setup/ports';

const event = (method: string, path: string, address = '203.0.113.9', headers: Record<string, string> = {}) => ({
	url: new URL(`http://bunchline.test${path}`),
	request: new Request(`http://bunchline.test${path}`, { method, headers }),
	getClientAddress: () => address
});

describe('ASVS 2.4.1 the form budget, as a rule', () => {
	it('counts signed-out POSTs per address; page views, the API (its own limit) and signed-in people are not counted', () => {
		const limit = formPostLimiter(tokenBucketLimiter(60, 2));
		expect(limit(event('POST', '/login?/signin'), false)).toBeNull();
		expect(limit(event('POST', '/reset?/choose'), false)).toBeNull();
		const refused = limit(event('POST', '/signup'), false);
		expect(refused?.status).toBe(429);
		expect(Number(refused?.headers.get('retry-after'))).toBeGreaterThan(0);
		expect(limit(event('POST', '/signup', '198.51.100.7'), false)).toBeNull();
		expect(limit(event('GET', '/login'), false)).toBeNull();
		expect(limit(event('POST', '/api/v1/plan-preview'), false)).toBeNull();
		expect(limit(event('POST', '/plants/1/log'), true)).toBeNull();
	});

	it('a form enhanced by SvelteKit gets an action error result it can show, with the wait in it', async () => {
		const limit = formPostLimiter(tokenBucketLimiter(60, 1));
		limit(event('POST', '/login?/signin'), false);
		const refused = limit(event('POST', '/login?/signin', '203.0.113.9', { 'x-sveltekit-action': 'true', accept: 'application/json' }), false)!;
		expect(refused.status).toBe(429);
		const body = await refused.json();
		expect(body).toMatchObject({ type: 'error', status: 429 });
		expect(body.error.message).toMatch(/^Too many form submissions from this address: wait \d+ s/);
	});
});

describe('ASVS 2.4.1 the running site refuses a flood of form posts from one address', () => {
	const port = testPorts.app + 3;
	const url = `http://127.0.0.1:${port}`;
	let server: ReturnType<typeof spawn>;
	beforeAll(async () => {
		server = spawn('node', ['scripts/serve.mjs'], {
			stdio: ['ignore', 'ignore', 'inherit'],
			env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), ORIGIN: url, BUNCHLINE_ENV: 'test', FORM_POSTS_PER_MINUTE: '5', ADDRESS_HEADER: 'x-forwarded-for', XFF_DEPTH: '1' }
		});
		for (let i = 0; ; i++) {
			if (await fetch(`${url}/login`, { headers: { 'x-forwarded-for': '192.0.2.1' } }).then((r) => r.ok, () => false)) break;
			if (i > 120) throw new Error('serve.mjs did not start');
			await new Promise((r) => setTimeout(r, 250));
		}
	}, 40_000);
	afterAll(() => void server?.kill('SIGTERM'));

	const reset = (address: string) =>
		fetch(`${url}/reset?/choose`, {
			method: 'POST',
			redirect: 'manual',
			headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: url, 'x-forwarded-for': address },
			body: 'token=aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa&password=a+long+enough+phrase+here'
		});

	it('five made-up-token resets are answered (410), the sixth is 429 with Retry-After; another address and page views are not affected', async () => {
		const statuses: number[] = [];
		for (let i = 0; i < 5; i++) statuses.push((await reset('203.0.113.9')).status);
		expect(statuses).toEqual([410, 410, 410, 410, 410]);
		const refused = await reset('203.0.113.9');
		expect(refused.status).toBe(429);
		expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0);
		expect(refused.headers.get('x-content-type-options')).toBe('nosniff');
		expect((await reset('198.51.100.7')).status).toBe(410);
		expect((await fetch(`${url}/login`, { headers: { 'x-forwarded-for': '203.0.113.9' } })).status).toBe(200);
	});
});
