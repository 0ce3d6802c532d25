// ASVS 3.7.2 / 5.1: the destination after sign-in is followed only when it stays on this site.
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { safeNext } from '../../src/lib/nav';
import { get, postForm, signedIn } from './helpers';

const SITE = 'http://bunchline.example';

/**
 * Whether a Location value keeps the browser on the site — also if something on the way (a proxy,
 * a framework normalising paths) decodes the path again and reads backslashes as slashes.
 */
function staysOnSite(value: string): boolean {
	const once = new URL(value, SITE);
	let path = once.pathname;
	for (let i = 0; i < 4; i++) {
		try {
			path = decodeURIComponent(path);
		} catch {
			break;
		}
	}
	const again = new URL(path.replace(/\\/g, '/'), SITE);
	return once.origin === SITE && again.origin === SITE && !again.pathname.startsWith('//') && !path.replace(/\\/g, '/').startsWith('//');
}

const examples = ['/.//evil.test/phish', '/..//evil.test', '/%2e%2e%2f%2fevil.test', '/./%2F/evil.test', '//evil.test/x', '/\\evil.test', '/\t/evil.test', '/%5c%5cevil.test', '/%252f%252fevil.test'];

describe('ASVS 3.7.2 open redirect after sign-in', () => {
	it('keeps same-site paths with their query and fragment', () => {
		expect(safeNext('/plants', '/')).toBe('/plants');
		expect(safeNext('/nursery/team?page=2#people', '/')).toBe('/nursery/team?page=2#people');
	});

	for (const next of [...examples, 'https://evil.test/', 'javascript:alert(1)', 'evil.test', '', '/\u0000', '/%0A']) {
		it(`refuses ${JSON.stringify(next)}`, () => expect(safeNext(next, '/home')).toBe('/home'));
	}

	it('whatever encoding of dots, slashes and backslashes comes before another host, the result stays on the site', () => {
		const piece = fc.constantFrom('/', '\\', '.', '..', '%2e', '%2E', '%2f', '%2F', '%5c', '%5C', '%252f', '%25252f', '%09', '\t', './', '../', '%2e%2e', '/./', '//');
		const next = fc.tuple(fc.array(piece, { minLength: 0, maxLength: 6 }), fc.constantFrom('evil.test', 'evil.test/phish', '@evil.test', 'evil.test:80/x')).map(
			([pieces, host]) => `/${pieces.join('')}${host}`
		);
		fc.assert(
			fc.property(next, (value) => {
				const result = safeNext(value, '/home');
				expect(result.startsWith('/')).toBe(true);
				expect(result.startsWith('//')).toBe(false);
				expect(staysOnSite(result), `${value} → ${result}`).toBe(true);
			}),
			{ numRuns: 3000, seed: 20261202 }
		);
	});

	it('what it returns can always go in a Location header', () => {
		for (const next of [...examples, '/\u0000', '/\u007f']) expect(() => new Headers({ location: safeNext(next, '/home') })).not.toThrow();
	});
});

describe('ASVS 3.7.2 open redirect on the running site', () => {
	beforeAll(() => seedDemo(process.env.DATABASE_URL!));
	const owner = DEMO_ACCOUNTS[0];

	for (const next of examples) {
		it(`signing in with next=${next} lands on this site`, async () => {
			const res = await postForm(`/login?/signin&next=${encodeURIComponent(next)}`, { email: owner.email, password: DEMO_PASSWORD });
			expect(res.status).toBe(303);
			expect(res.headers.get('location')).toBe('/nursery');
		});
		it(`a signed-in visit to /login?next=${next} lands on this site, and the form does not carry it`, async () => {
			const cookie = await signedIn(owner.email, DEMO_PASSWORD);
			const res = await get(`/login?next=${encodeURIComponent(next)}`, cookie);
			expect(res.headers.get('location')).toBe('/nursery');
			const page = await (await get(`/login?next=${encodeURIComponent(next)}`)).text();
			expect(page).not.toContain('evil.test');
		});
	}
});
