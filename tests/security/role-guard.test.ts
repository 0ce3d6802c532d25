// The role × route matrix (ASVS 8.2.1, 8.3.1): every protected page answers 403 to the wrong role
// and sends a signed-out visitor to sign-in; the guard runs on the server for pages and actions.
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { baseUrl } from '../helpers/browser';
import { postForm, sessionCookie } from '../helpers/session';

const STAFF_ONLY = [
	'/nursery/stall',
	'/nursery/stock',
	'/nursery/sales/1/card',
	'/nursery/plants',
	'/nursery/plants/import',
	'/nursery/reminders',
	'/nursery/guides',
	'/nursery/guides/new',
	'/nursery/guides/[id]',
	'/nursery/guides/[id]/revisions/1',
	'/nursery/questions',
	'/nursery/questions/[id]'
];
const CATALOGUE_PAGES = ['/nursery/cultivars', '/nursery/cultivars/new', '/nursery/cultivars/grand-nain', '/nursery/climates', '/nursery/settings'];
/** Owner-only form actions: gardeners and staff get 403 and nothing is written. */
const OWNER_ACTIONS = [
	'/nursery/cultivars/new',
	'/nursery/cultivars/grand-nain?/save',
	'/nursery/cultivars/grand-nain?/retire',
	'/nursery/climates',
	'/nursery/climates/grand-nain?/save',
	'/nursery/climates/grand-nain?/delete',
	'/nursery/settings'
];
const GARDENER_ONLY = ['/ask'];
/** Pages of one gardener's own things: 404 to everyone but their owner and staff, signed out too. */
const ASKER_ONLY = ['/questions/[id]'];
const OWNER_ONLY = ['/nursery', '/nursery/team', '/dev/mail', '/dev/mail/x.eml', ...CATALOGUE_PAGES, '/nursery/climates/grand-nain'];
const SIGNED_IN = ['/plants', '/settings', '/settings/account'];
/** One record's pages for any signed-in account; who may see which record is tested in plant-access.test.ts. */
const RECORD_PAGES = ['/plants/1', '/plants/1/log'];
/** Photos: public only where what they belong to is public, so a signed-out request for any other is 404 (who may see which photo: tests/e2e/board-photos.test.ts). */
const PHOTOS = ['/uploads/1/thumbnail', '/uploads/1/display'];
/** JSON endpoints that read the session: signed out 401, wrong role 403 (in the API's error shape). */
const API: { path: string; method: string; roles: 'staff' | 'owner' | 'signed-in' }[] = [
	{ path: '/api/v1/stock', method: 'GET', roles: 'staff' },
	{ path: '/api/v1/stock', method: 'POST', roles: 'owner' },
	{ path: '/api/v1/sales', method: 'POST', roles: 'staff' },
	{ path: '/api/v1/sales/1', method: 'DELETE', roles: 'staff' },
	{ path: '/api/v1/plants', method: 'GET', roles: 'signed-in' },
	{ path: '/api/v1/plants.csv', method: 'GET', roles: 'staff' },
	{ path: '/api/v1/past-sales', method: 'POST', roles: 'staff' },
	{ path: '/api/v1/plants/1', method: 'GET', roles: 'signed-in' },
	{ path: '/api/v1/plants/1', method: 'PATCH', roles: 'signed-in' },
	{ path: '/api/v1/plants/1/milestones', method: 'POST', roles: 'signed-in' },
	{ path: '/api/v1/plants/1/milestones/1', method: 'PATCH', roles: 'signed-in' },
	{ path: '/api/v1/plants/1/milestones/1', method: 'DELETE', roles: 'signed-in' },
	{ path: '/api/v1/feeds', method: 'GET', roles: 'signed-in' },
	{ path: '/api/v1/feeds', method: 'POST', roles: 'signed-in' },
	{ path: '/api/v1/feeds/1', method: 'DELETE', roles: 'signed-in' },
	{ path: '/api/preview', method: 'POST', roles: 'signed-in' }
];
/** Pages anyone may open whose actions need an account (the claim page shows the plant first). */
const ACTIONS_SIGNED_IN = ['/claim/abcdefghijklmnopqrstuvwxyz234567'];
const apiCall = (method: string, path: string, cookie?: string) =>
	fetch(`${baseUrl()}${path}`, {
		method,
		redirect: 'manual',
		headers: { 'content-type': 'application/json', ...(cookie ? { cookie } : {}) },
		...(method === 'GET' ? {} : { body: '{}' })
	});
/** The draft guide and the private question the "[id]"s below stand for, written in beforeAll. */
let guideId = 0;
let questionId = 0;
const at = (path: string) => path.replace(/^\/nursery\/guides\/\[id\]/, `/nursery/guides/${guideId}`).replace(/questions\/\[id\]/, `questions/${questionId}`);

const get = (path: string, cookie?: string) =>
	fetch(`${baseUrl()}${at(path)}`, { redirect: 'manual', headers: cookie ? { cookie } : {} });
const post = (path: string, cookie?: string) =>
	fetch(`${baseUrl()}${at(path)}`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: baseUrl(), ...(cookie ? { cookie } : {}) },
		body: new URLSearchParams({ email: 'someone@example.test', role: 'staff', userId: '1' })
	});

/** Route paths whose server files call the guard, e.g. "/nursery/team" or "/dev/mail/[file]". */
function guardedRoutes(dir = join(process.cwd(), 'src/routes')): string[] {
	return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
		const p = join(dir, e.name);
		if (e.isDirectory()) return guardedRoutes(p);
		if (!/^\+(page|layout)\.server\.ts$|^\+server\.ts$/.test(e.name) || !readFileSync(p, 'utf8').includes('requireUser(')) return [];
		return ['/' + relative(join(process.cwd(), 'src/routes'), dir).replaceAll('\\', '/')].map((r) => (r === '/' ? r : r.replace(/\/$/, '')));
	});
}

const asTested = (route: string) =>
	route
		.replace('[file]', 'x.eml')
		.replace('[variant]', 'thumbnail')
		.replace('[milestoneId]', '1')
		.replace(/^\/(plants|uploads)\/\[id\]/, '/$1/1').replace('[number]', '1').replace('[slug]', 'grand-nain').replace('/nursery/sales/[id]', '/nursery/sales/1').replace('[code]', 'abcdefghijklmnopqrstuvwxyz234567').replace(/^(\/api\/v1\/[\w-]+\/)\[id\]/, '$11');
const SIGN_OUT = '/logout';

let gardener: string;
let otherGardener: string;
let staff: string;
let owner: string;

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	[owner, staff, gardener] = await Promise.all([
		sessionCookie(DEMO_ACCOUNTS[0].email),
		sessionCookie(DEMO_ACCOUNTS[1].email),
		sessionCookie(DEMO_ACCOUNTS[3].email)
	]);
	const draft = await postForm('/nursery/guides/new', { title: 'Role guard draft', summary: 'A draft for the guard tests.', body: 'Text.' }, staff);
	guideId = Number(draft.headers.get('location')?.match(/\/nursery\/guides\/(\d+)/)?.[1]);
	if (!guideId) throw new Error(`no draft guide (${draft.status})`);
	const asked = await postForm('/ask', { title: 'Role guard question', body: 'A private question for the guard tests.' }, gardener);
	questionId = Number(asked.headers.get('location')?.match(/\/questions\/(\d+)/)?.[1]);
	if (!questionId) throw new Error(`no question (${asked.status})`);
	otherGardener = await sessionCookie(DEMO_ACCOUNTS[4].email);
});
afterAll(() => {});

describe('coverage', () => {
	it('every guarded route in src/routes is exercised below', () => {
		const tested = new Set([...STAFF_ONLY, ...OWNER_ONLY, ...SIGNED_IN, ...GARDENER_ONLY, ...ASKER_ONLY, ...RECORD_PAGES, SIGN_OUT, ...API.map((a) => a.path), ...ACTIONS_SIGNED_IN]);
		for (const route of guardedRoutes()) expect(tested, route).toContain(asTested(route));
	});
});

describe('signed out', () => {
	for (const path of ASKER_ONLY) it(`GET ${path} of a private question is 404`, async () => expect((await get(path)).status).toBe(404));
	for (const path of PHOTOS) it(`GET ${path} of a private photo is 404`, async () => expect((await get(path)).status).toBe(404));
	for (const path of [...STAFF_ONLY, ...OWNER_ONLY, ...SIGNED_IN, ...GARDENER_ONLY, ...RECORD_PAGES, SIGN_OUT]) {
		it(`GET ${path} redirects to sign-in`, async () => {
			const res = await get(path);
			expect(res.status).toBe(303);
			expect(res.headers.get('location')).toMatch(/^\/login\?next=/);
		});
	}
	for (const path of ACTIONS_SIGNED_IN) {
		it(`POST ${path} redirects to sign-in`, async () => {
			const res = await post(path);
			expect(res.status).toBe(303);
			expect(res.headers.get('location')).toMatch(/^\/login\?next=/);
		});
	}
	it('POST to a settings action redirects to sign-in', async () => {
		const res = await post('/settings?/createFeed');
		expect(res.status).toBe(303);
		expect(res.headers.get('location')).toMatch(/^\/login\?next=/);
	});
	it('POST to a team action redirects to sign-in and changes nothing', async () => {
		const res = await post('/nursery/team?/invite');
		expect(res.status).toBe(303);
		expect(res.headers.get('location')).toMatch(/^\/login\?next=/);
	});
});

describe('a gardener', () => {
	for (const path of GARDENER_ONLY) it(`GET ${path} is 200`, async () => expect((await get(path, gardener)).status).toBe(200));
	for (const path of ASKER_ONLY) {
		it(`GET ${path} is 200 for its asker and 404 for another gardener`, async () => {
			expect((await get(path, gardener)).status).toBe(200);
			expect((await get(path, otherGardener)).status).toBe(404);
		});
	}
	for (const path of [...STAFF_ONLY, ...OWNER_ONLY]) {
		it(`GET ${path} is 403`, async () => expect((await get(path, gardener)).status).toBe(403));
	}
	for (const action of ['/nursery/team?/invite', '/nursery/team?/role', '/nursery/stall?/sell', '/nursery/stall?/undo', '/nursery/stock?/receive', '/nursery/stock?/adjust', '/nursery/stock?/move', '/nursery/stock?/marketDay', '/nursery/sales/1/card?/resend', '/nursery/sales/1/card?/reissue', '/nursery/guides/new', '/nursery/guides/[id]?/save', '/nursery/guides/[id]?/publish', '/nursery/guides/[id]?/restore', '/nursery/questions/[id]?/answer', '/nursery/questions/[id]?/claim', '/nursery/questions/[id]?/state', '/nursery/questions/[id]?/guide', ...OWNER_ACTIONS]) {
		it(`POST ${action} is 403`, async () => {
			const res = await post(action, gardener);
			expect(res.status).toBe(403);
		});
	}
	it('cannot raise their own role', async () => {
		const res = await fetch(`${baseUrl()}/nursery/team?/role`, {
			method: 'POST',
			redirect: 'manual',
			headers: { 'content-type': 'application/x-www-form-urlencoded', origin: baseUrl(), cookie: gardener },
			body: new URLSearchParams({ userId: '4', role: 'owner' })
		});
		expect(res.status).toBe(403);
		expect((await get('/nursery', gardener)).status).toBe(403);
	});
});

describe('the JSON API', () => {
	for (const { path, method, roles } of API) {
		it(`${method} ${path} signed out is 401 in the API's error shape`, async () => {
			const res = await apiCall(method, path);
			expect(res.status).toBe(401);
			expect(((await res.json()) as { error: { message: string } }).error.message).toBeTruthy();
		});
		if (roles !== 'signed-in') {
			it(`${method} ${path} is 403 for a gardener`, async () => expect((await apiCall(method, path, gardener)).status).toBe(403));
		}
		if (roles === 'owner') {
			it(`${method} ${path} is 403 for staff`, async () => expect((await apiCall(method, path, staff)).status).toBe(403));
		}
	}
	it('GET /api/v1/plants for a gardener is 200 with only plants they claimed', async () => {
		const res = await apiCall('GET', '/api/v1/plants?claimed=no', gardener);
		expect(res.status).toBe(200);
		expect(((await res.json()) as { total: number }).total).toBe(0);
	});
	for (const path of ['/api/v1/plants', '/api/v1/plants.csv']) {
		it(`GET ${path} is 200 for staff`, async () => expect((await apiCall('GET', path, staff)).status).toBe(200));
	}
	it('a cross-site form post to a cookie-authenticated endpoint is refused', async () => {
		const res = await fetch(`${baseUrl()}/api/v1/sales`, {
			method: 'POST',
			redirect: 'manual',
			headers: { 'content-type': 'application/x-www-form-urlencoded', origin: 'http://evil.example', cookie: staff },
			body: new URLSearchParams({ batchId: '1', quantity: '1', pricePerPlant: '1', clientId: crypto.randomUUID() })
		});
		expect(res.status).toBe(403);
	});
});

describe('feeds of another account', () => {
	it("a gardener cannot revoke another account's feed (404), and their own list is theirs alone", async () => {
		const made = await fetch(`${baseUrl()}/api/v1/feeds`, {
			method: 'POST',
			headers: { 'content-type': 'application/json', cookie: staff },
			body: '{}'
		});
		expect(made.status).toBe(201);
		const { id, url } = (await made.json()) as { id: number; url: string };
		const res = await fetch(`${baseUrl()}/api/v1/feeds/${id}`, { method: 'DELETE', headers: { cookie: gardener } });
		expect(res.status).toBe(404);
		const mine = (await (await get('/api/v1/feeds', gardener)).json()) as { feeds: { id: number }[] };
		expect(mine.feeds.map((f) => f.id)).not.toContain(id);
		expect((await fetch(url)).status).toBe(200);
	});
});

describe('staff', () => {
	for (const path of STAFF_ONLY) it(`GET ${path} is 200`, async () => expect((await get(path, staff)).status).toBe(200));
	for (const path of GARDENER_ONLY) it(`GET ${path} is 403`, async () => expect((await get(path, staff)).status).toBe(403));
	for (const path of ASKER_ONLY) it(`GET ${path} is 200`, async () => expect((await get(path, staff)).status).toBe(200));
	it('cannot publish a guide', async () => {
		expect((await post('/nursery/guides/[id]?/publish', staff)).status).toBe(403);
		expect((await post('/nursery/guides/[id]?/unpublish', staff)).status).toBe(403);
		expect((await post('/nursery/questions/[id]?/guide', staff)).status).toBe(403);
		expect((await get(`/guides/role-guard-draft`)).status).toBe(404);
	});
	for (const path of OWNER_ONLY) it(`GET ${path} is 403`, async () => expect((await get(path, staff)).status).toBe(403));
	it('POST /nursery/stock?/receive (the owner receives stock) is 403', async () => expect((await post('/nursery/stock?/receive', staff)).status).toBe(403));
	for (const action of OWNER_ACTIONS) it(`POST ${action} is 403`, async () => expect((await post(action, staff)).status).toBe(403));
	it('a refused owner page says it is for the owner, not for staff', async () => {
		const page = await (await get('/nursery/team', staff)).text();
		expect(page).toContain("for the nursery's owner only");
		expect(page).not.toContain('for nursery staff only');
	});
});

describe('the owner', () => {
	for (const path of [...STAFF_ONLY, '/nursery', '/nursery/team', '/dev/mail', ...SIGNED_IN, ...CATALOGUE_PAGES]) {
		it(`GET ${path} is 200`, async () => expect((await get(path, owner)).status).toBe(200));
	}
});

describe('cookies', () => {
	it('the session cookie is HttpOnly and SameSite=Lax', async () => {
		const login = await fetch(`${baseUrl()}/login?/signin`, {
			method: 'POST',
			redirect: 'manual',
			headers: { 'content-type': 'application/x-www-form-urlencoded', origin: baseUrl() },
			body: new URLSearchParams({ email: DEMO_ACCOUNTS[4].email, password: DEMO_PASSWORD })
		});
		const cookie = login.headers.getSetCookie().find((c) => c.startsWith('bunchline_session='))!;
		expect(cookie).toMatch(/HttpOnly/i);
		expect(cookie).toMatch(/SameSite=Lax/i);
	});
	it('a cross-site form post is refused', async () => {
		const res = await fetch(`${baseUrl()}/login?/signin`, {
			method: 'POST',
			redirect: 'manual',
			headers: { 'content-type': 'application/x-www-form-urlencoded', origin: 'http://evil.example' },
			body: new URLSearchParams({ email: 'a@b.test', password: 'x' })
		});
		expect(res.status).toBe(403);
	});
});
