// ASVS 3.4.x, 14.3.2 and 3.3.1: every response, static files included, carries the browser
// protections; pages with personal data are never stored; the session cookie's flags.
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { get, postForm, sessionCookieOf, signedIn } from './helpers';

let owner: string;
let appAsset: string;

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	owner = await signedIn(DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
	const home = await (await get('/')).text();
	appAsset = home.match(/(\/_app\/immutable\/[^"']+\.js)/)![1];
});

describe('ASVS 3.4.4 and 3.4.6 static files carry nosniff and frame protection', () => {
	const files: [string, () => string][] = [['a script under /_app', () => appAsset], ['/favicon.svg', () => '/favicon.svg']];
	for (const [label, path] of files) {
		it(label, async () => {
			const res = await get(path());
			expect(res.status).toBe(200);
			expect(res.headers.get('x-content-type-options')).toBe('nosniff');
			expect(res.headers.get('x-frame-options')).toBe('DENY');
		});
	}
	it('pages and API answers carry them too', async () => {
		for (const path of ['/', '/login', '/api/v1/cultivars']) {
			const res = await get(path);
			expect(res.headers.get('x-content-type-options'), path).toBe('nosniff');
			expect(res.headers.get('x-frame-options'), path).toBe('DENY');
		}
	});
});

describe('ASVS 14.3.2 pages with personal data are not stored by browsers or proxies', () => {
	for (const path of ['/nursery/team', '/dev/mail', '/reset?token=abcdefghijklmnopqrstuvwxyz234567', '/settings/account']) {
		it(`${path} is Cache-Control: no-store`, async () => {
			const res = await get(path, owner);
			expect(res.status).toBe(200);
			expect(res.headers.get('cache-control')).toMatch(/no-store/);
		});
	}
	it('the public catalogue may still be cached', async () => {
		expect((await get('/api/v1/cultivars')).headers.get('cache-control')).toMatch(/max-age/);
	});
});

describe('ASVS 3.3.1 and 3.3.2 the session cookie', () => {
	it('is HttpOnly, SameSite=Lax and for the whole site only (the __Host- prefix applies over https: see configuration.test.ts)', async () => {
		const res = await postForm('/login?/signin', { email: DEMO_ACCOUNTS[4].email, password: DEMO_PASSWORD });
		const cookie = sessionCookieOf(res)!;
		expect(cookie).toMatch(/HttpOnly/i);
		expect(cookie).toMatch(/SameSite=Lax/i);
		expect(cookie).toMatch(/Path=\//i);
		expect(cookie).not.toMatch(/Domain=/i);
	});
});
