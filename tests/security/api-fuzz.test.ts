// ASVS 1.2.5 / 2.2.1 / 8.2.x: every JSON endpoint under arbitrary input. Bodies built from each
// route's zod schema with any field wrong, huge, full of control characters or unicode, missing, or
// joined by fields nobody expects; any JSON value, raw text, bytes and content type; odd ids in the
// path and odd query strings; signed in with the role that reaches validation, signed out, and as
// the wrong role or another gardener. Never a 5xx; a refused request (4xx) changes no row.
import { randomUUID } from 'node:crypto';
import { Agent, request } from 'node:http';
import { sql } from 'drizzle-orm';
import fc from 'fast-check';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { climates, cultivars } from '$lib/care';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { POST } from '../../src/routes/api/v1/plan-preview/+server';
import { GET as GET_ICS } from '../../src/routes/api/v1/plan-preview.ics/+server';
import { ID_MAX } from '../../src/lib/schema/fields';
import { previewSchema } from '../../src/lib/schema/guides';
import { newFeedSchema } from '../../src/lib/schema/delivery';
import { milestonePatchSchema, milestoneSchema, plantPatchSchema } from '../../src/lib/schema/plant';
import { PLANT_SORTS, plantTableQuerySchema, TABLE_STAGES } from '../../src/lib/schema/plant-table';
import { PAST_SALE_COLUMNS, PAST_SALES_TEMPLATE } from '../../src/lib/schema/past-sales';
import { receiveSchema, saleSchema } from '../../src/lib/schema/stock';
import { db } from '../../src/lib/server/db';
import { call, postJson, validBody } from '../integration/api/helpers';
import { nastyText, schemaKeys } from './fuzz';
import { baseUrl, signedIn } from './helpers';

const SEED = process.env.API_FUZZ_SEED === 'random' ? Date.now() : Number(process.env.API_FUZZ_SEED ?? 20261202);
if (process.env.API_FUZZ_SEED === 'random') console.log(`API_FUZZ_SEED=${SEED}`);
// Every case is a round trip to the server: report the first failing one as it is rather than spend minutes shrinking it.
fc.configureGlobal({ seed: SEED, numRuns: 30, endOnFailure: true });

// ---------------------------------------------------------------------------------------------
// Requests over HTTP to the production build, through its hooks (session, origin check, limits).

/**
 * The /api/ limit counts per client address (120 a minute). Each request leaves from the next of
 * these loopback addresses, so the fuzz reaches validation instead of a 429, and 127.0.0.1 keeps
 * its whole budget for the other files (public-api.test.ts counts on it).
 */
const SOURCES = Array.from({ length: 48 }, (_, i) => `127.0.9.${i + 1}`);
// A fresh connection each time: nothing a refused request left on a socket reaches the next one.
const agent = new Agent({ keepAlive: false });
let turn = 0;

interface Sent {
	method: string;
	/** Already encoded: the fuzz chooses what reaches the request line. */
	path: string;
	cookie?: string;
	body?: string | Uint8Array;
	type?: string;
}
interface Answer {
	status: number;
	type: string;
	text: string;
}

function send({ method, path, cookie, body, type }: Sent): Promise<Answer> {
	const bytes = typeof body === 'string' ? Buffer.from(body) : body;
	const headers: Record<string, string | number> = { origin: baseUrl(), accept: 'application/json' };
	if (cookie) headers.cookie = cookie;
	if (type !== undefined) headers['content-type'] = type;
	if (bytes) headers['content-length'] = bytes.length;
	const { hostname, port } = new URL(baseUrl());
	return new Promise((resolve, reject) => {
		const req = request({ host: hostname, port, path, method, headers, agent, localAddress: SOURCES[turn++ % SOURCES.length] }, (res) => {
			const chunks: Buffer[] = [];
			res.on('data', (c: Buffer) => chunks.push(c));
			res.on('end', () => resolve({ status: res.statusCode ?? 0, type: String(res.headers['content-type'] ?? ''), text: Buffer.concat(chunks).toString() }));
			res.on('error', reject);
		});
		req.on('error', reject);
		// A request the server never answers is a finding too: name it rather than time the whole test out.
		req.setTimeout(15_000, () => req.destroy(new Error(`no answer in 15 s to ${method} ${path.slice(0, 300)}`)));
		req.end(bytes);
	});
}

/** A number literal JSON.stringify cannot write (1e309, -0, 30 digits), spliced into the body text as it is. */
const rawNumber = (literal: string) => `@@raw:${literal}@@`;
const toJson = (value: unknown) => (JSON.stringify(value) ?? 'null').replace(/"@@raw:([^@"]+)@@"/g, '$1');

// ---------------------------------------------------------------------------------------------
// Rows: a refused request adds, removes and changes none.

/** Tables whose every row is compared (the API writes these); the rest are counted. */
const CONTENT = ['plants', 'milestones', 'plan_steps', 'plan_changes', 'calendar_feeds', 'sales', 'stock_batches', 'stock_movements', 'market_days', 'cultivars', 'climate_profiles', 'waitlist_entries', 'uploads', 'users', 'nursery_settings'];
/** Bookkeeping of the sign-in and mail limits: written by design whatever the answer. */
const NOT_COMPARED = ['sign_in_attempts'];
let snapshotSql = sql``;

async function snapshot(): Promise<Record<string, string>> {
	const rows = await db.execute<{ t: string; v: string }>(snapshotSql);
	return Object.fromEntries([...rows].map((r) => [r.t, r.v]));
}

let baseline: Record<string, string> = {};

/** Sends, then holds the answer to the rules: below 500; a 400 names its fields; a refusal leaves every row as it was. */
async function expectSafe(sent: Sent, allowed?: number[]): Promise<Answer> {
	const answer = await send(sent);
	const what = `${sent.method} ${sent.path.slice(0, 200)} ${typeof sent.body === 'string' ? sent.body.slice(0, 300) : ''} → ${answer.status} ${answer.text.slice(0, 300)}`;
	expect(answer.status, what).toBeLessThan(500);
	if (allowed) expect(allowed, what).toContain(answer.status);
	// Node's own HTTP parser refuses a malformed request line with a bare 400 before the app sees it.
	if (answer.status === 400 && answer.text) {
		expect(answer.type, what).toContain('application/json');
		expect(JSON.parse(answer.text).error.message, what).toBeTruthy();
	}
	const now = await snapshot();
	if (answer.status >= 400) expect(Object.keys(now).filter((t) => now[t] !== baseline[t]), `rows changed by ${what}`).toEqual([]);
	baseline = now;
	return answer;
}

// ---------------------------------------------------------------------------------------------
// The demo nursery, its people and the records the paths point at.

let owner = '';
let staff = '';
/** Pim, with claimed plants; Sol, another gardener whose things Pim must not reach. */
let pim = '';
let sol = '';
let today = '';
const ids = { pimPlant: 0, pimPlantedOn: '', solPlant: 0, pimMilestone: 0, solMilestone: 0, pimFeed: 0, solFeed: 0, batch: 0, oldSale: 0 };

const one = async <T extends Record<string, unknown>>(query: ReturnType<typeof sql>) => [...(await db.execute<T>(query))][0];

async function plantOf(email: string) {
	return one<{ id: number; planted_on: string }>(
		sql`select p.id, p.planted_on::text from plants p join users u on u.id = p.gardener_id where u.email = ${email} and p.planted_on is not null order by p.id limit 1`
	);
}

async function made(sent: Sent): Promise<number> {
	const res = await send(sent);
	if (res.status !== 201) throw new Error(`${sent.method} ${sent.path}: ${res.status} ${res.text}`);
	const body = JSON.parse(res.text);
	return body.milestone?.id ?? body.id;
}

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	[owner, staff, pim, sol] = [await signedIn(DEMO_ACCOUNTS[0].email, DEMO_PASSWORD), await signedIn(DEMO_ACCOUNTS[1].email, DEMO_PASSWORD), await signedIn(DEMO_ACCOUNTS[3].email, DEMO_PASSWORD), await signedIn(DEMO_ACCOUNTS[4].email, DEMO_PASSWORD)];
	const [p, s] = [await plantOf(DEMO_ACCOUNTS[3].email), await plantOf(DEMO_ACCOUNTS[4].email)];
	Object.assign(ids, { pimPlant: p.id, pimPlantedOn: p.planted_on, solPlant: s.id });
	today = (await one<{ d: string }>(sql`select current_date::text as d`)).d;
	const milestone = (plantedOn: string) => JSON.stringify({ kind: 'leaves', on: plantedOn, leaves: 6, note: 'Counted at the fence' });
	ids.pimMilestone = await made({ method: 'POST', path: `/api/v1/plants/${p.id}/milestones`, cookie: pim, type: 'application/json', body: milestone(p.planted_on) });
	ids.solMilestone = await made({ method: 'POST', path: `/api/v1/plants/${s.id}/milestones`, cookie: sol, type: 'application/json', body: milestone(s.planted_on) });
	ids.pimFeed = await made({ method: 'POST', path: '/api/v1/feeds', cookie: pim, type: 'application/json', body: JSON.stringify({ plantId: p.id }) });
	ids.solFeed = await made({ method: 'POST', path: '/api/v1/feeds', cookie: sol, type: 'application/json', body: '{}' });
	ids.batch = (await one<{ id: number }>(sql`select id from stock_batches order by on_hand desc, id limit 1`)).id;
	// A sale older than the undo window (the seed's are as new as the seed), so undoing it is refused.
	ids.oldSale = (await one<{ id: number }>(sql`update sales set created_at = now() - interval '1 day' where id = (select min(id) from sales where undone_at is null) returning id`)).id;
	const tables = [...(await db.execute<{ t: string }>(sql`select table_name as t from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by 1`))]
		.map((r) => r.t)
		.filter((t) => !NOT_COMPARED.includes(t) && /^[a-z_]+$/.test(t));
	snapshotSql = sql.raw(
		tables
			.map((t) => `select '${t}' as t, count(*)::text || ${CONTENT.includes(t) ? `':' || md5(coalesce(string_agg(x::text, '|' order by x::text), ''))` : `''`} as v from ${t} x`)
			.join(' union all ')
	);
	baseline = await snapshot();
}, 180_000);
// A test that failed part-way leaves no stale picture for the next one.
beforeEach(async () => {
	if (snapshotSql.queryChunks.length) baseline = await snapshot();
});
afterEach(() => db.execute(sql`delete from sign_in_attempts`));
afterAll(() => agent.destroy());

// ---------------------------------------------------------------------------------------------
// What goes in.

/** Values of any JSON type a field might get instead of the right one. */
const nastyNumber = fc.oneof(
	fc.integer(),
	fc.double(),
	fc.constantFrom(0, -1, ID_MAX, ID_MAX + 1, -(ID_MAX + 2), 1e308, 5e-324, 2 ** 53 + 2, 0.1 + 0.2),
	fc.constantFrom('1e309', '-1e309', '1e-400', '123456789012345678901234567890', '-0').map(rawNumber)
);
const nastyValue: fc.Arbitrary<unknown> = fc.oneof(
	nastyText,
	nastyNumber,
	fc.boolean(),
	fc.constantFrom(null, [], {}),
	fc.jsonValue({ maxDepth: 2 }),
	fc.array(fc.oneof(nastyText, nastyNumber), { maxLength: 14 })
);
const extraKey = fc.oneof(fc.constantFrom('__proto__', 'constructor', 'toString', 'prototype', 'hasOwnProperty', 'id', 'gardenerId', 'userId', 'role', ''), fc.string({ maxLength: 12 }));

/**
 * The poisons every field of every body gets one at a time, the rest of the body valid, so each
 * reaches as deep as it can: appended to the right value where that is text (a NUL at the end of
 * a valid date or slug), or in its place.
 */
const POISONS: [string, (valid: unknown) => unknown][] = [
	['NUL', (v) => (typeof v === 'string' ? `${v}\u0000` : '\u0000')],
	['bidi override', (v) => (typeof v === 'string' ? `\u202E${v}` : '\u202E1')],
	['line break', (v) => (typeof v === 'string' ? `${v}\r\nX-Injected: 1` : '\r\n')],
	['unicode', (v) => (typeof v === 'string' ? `${v}\u{1F34C}\u0301` : '\u0661')],
	['huge', (v) => (typeof v === 'string' ? v + 'x'.repeat(100_000) : '9'.repeat(100_000))],
	['2147483648', () => ID_MAX + 1],
	['-1', () => -1],
	['1e309', () => rawNumber('1e309')],
	['fraction', (v) => (typeof v === 'number' ? v + 0.5 : 1.5)],
	['number as text', (v) => String(v)],
	['empty text', () => ''],
	['null', () => null],
	['object', (v) => ({ value: v })],
	['array', (v) => [v]],
	['boolean', () => true]
];

interface BodyRoute {
	method: string;
	path: () => string;
	who: () => string;
	schema: unknown;
	/** A body the route accepts (a fresh one for each request: a sale needs its own client id). */
	valid: () => Record<string, unknown>;
}

const BODY_ROUTES: BodyRoute[] = [
	{ method: 'POST', path: () => '/api/preview', who: () => staff, schema: previewSchema, valid: () => ({ markdown: '## Feeding\n\nA *handful* a month.' }) },
	{ method: 'POST', path: () => '/api/v1/feeds', who: () => pim, schema: newFeedSchema, valid: () => ({ plantId: ids.pimPlant }) },
	{
		method: 'PATCH',
		path: () => `/api/v1/plants/${ids.pimPlant}`,
		who: () => pim,
		schema: plantPatchSchema,
		valid: () => ({ plantedOn: ids.pimPlantedOn, climate: climates[0].slug, units: 'metric', archived: false })
	},
	{
		method: 'POST',
		path: () => `/api/v1/plants/${ids.pimPlant}/milestones`,
		who: () => pim,
		schema: milestoneSchema,
		valid: () => ({ kind: 'leaves', on: ids.pimPlantedOn, generation: 0, leaves: 9, note: 'Two new leaves' })
	},
	{
		method: 'PATCH',
		path: () => `/api/v1/plants/${ids.pimPlant}/milestones/${ids.pimMilestone}`,
		who: () => pim,
		schema: milestonePatchSchema,
		valid: () => ({ on: ids.pimPlantedOn, leaves: 7, note: 'Recounted' })
	},
	{
		method: 'POST',
		path: () => '/api/v1/sales',
		who: () => staff,
		schema: saleSchema,
		valid: () => ({ batchId: ids.batch, quantity: 1, pricePerPlant: 12.5, clientId: randomUUID() })
	},
	{ method: 'POST', path: () => '/api/v1/stock', who: () => owner, schema: receiveSchema, valid: () => ({ cultivar: cultivars[0].slug, count: 3, pottedOn: today }) }
];

/** A valid body with some fields wrong, some missing and some nobody expects. */
function mutatedBody(route: BodyRoute): fc.Arbitrary<() => Record<string, unknown>> {
	const keys = schemaKeys(route.schema);
	return fc
		.record({
			wrong: fc.uniqueArray(fc.tuple(fc.constantFrom(...keys), nastyValue), { minLength: 1, maxLength: 3, selector: ([k]) => k }),
			missing: fc.subarray(keys, { maxLength: Math.min(2, keys.length) }),
			extra: fc.array(fc.tuple(extraKey, nastyValue), { maxLength: 2 })
		})
		.map(({ wrong, missing, extra }) => () => Object.fromEntries([...Object.entries(route.valid()).filter(([k]) => !missing.includes(k)), ...wrong, ...extra]));
}

const JSON_TYPE = 'application/json';

describe('ASVS 2.2.1 every JSON body field under arbitrary input (signed in with the role that reaches validation)', () => {
	for (const route of BODY_ROUTES) {
		const name = `${route.method} ${route.path().replace(/\/\d+/g, '/[id]')}`;
		it(`${name}: each field poisoned in an otherwise valid body: never a 5xx, a refusal changes no row`, async () => {
			for (const key of schemaKeys(route.schema)) {
				for (const [, poison] of POISONS) {
					const valid = route.valid();
					const body = Object.fromEntries([...Object.entries(valid).filter(([k]) => k !== key), [key, poison(valid[key])]]);
					await expectSafe({ method: route.method, path: route.path(), cookie: route.who(), type: JSON_TYPE, body: toJson(body) });
				}
			}
		});
		it(`${name}: fields wrong, missing and extra (__proto__, toString): never a 5xx, a refusal changes no row`, async () => {
			await fc.assert(
				fc.asyncProperty(mutatedBody(route), async (body) => {
					await expectSafe({ method: route.method, path: route.path(), cookie: route.who(), type: JSON_TYPE, body: toJson(body()) });
				})
			);
		});
	}
});

/** One CSV cell, quoted the way a spreadsheet writes it. */
const csvCell = (v: string) => `"${v.replaceAll('"', '""')}"`;
const VALID_PAST_SALE = PAST_SALES_TEMPLATE.split('\r\n')[1].split(',');

describe('ASVS 2.2.1 past sales (CSV) under arbitrary input', () => {
	it('POST /api/v1/past-sales: rows with any cell wrong, columns missing or extra: never a 5xx, a refusal changes no row', async () => {
		const row = fc.array(fc.oneof(fc.constantFrom(...VALID_PAST_SALE), nastyText), { minLength: PAST_SALE_COLUMNS.length, maxLength: PAST_SALE_COLUMNS.length });
		const header = fc.oneof(fc.constant([...PAST_SALE_COLUMNS] as string[]), fc.shuffledSubarray([...PAST_SALE_COLUMNS, 'notes', '__proto__', 'toString']));
		await fc.assert(
			fc.asyncProperty(header, fc.array(row, { minLength: 1, maxLength: 4 }), fc.constantFrom('\r\n', '\n', '\r'), async (columns, rows, eol) => {
				const text = [columns, ...rows].map((r) => r.map(csvCell).join(',')).join(eol);
				await expectSafe({ method: 'POST', path: '/api/v1/past-sales', cookie: staff, type: 'text/csv', body: text });
			})
		);
	});
	it('POST /api/v1/past-sales: each cell poisoned in an otherwise valid row', async () => {
		for (let column = 0; column < PAST_SALE_COLUMNS.length; column++) {
			for (const [, poison] of POISONS) {
				const cells = VALID_PAST_SALE.map((v, i) => (i === column ? String(poison(v)).replace(/^@@raw:(.*)@@$/, '$1') : v));
				await expectSafe({ method: 'POST', path: '/api/v1/past-sales', cookie: staff, type: 'text/csv', body: [PAST_SALE_COLUMNS.join(','), cells.map(csvCell).join(',')].join('\r\n') });
			}
		}
	});
});

// ---------------------------------------------------------------------------------------------
// Every endpoint and method, with what a client may send wrong whatever the route.

interface Endpoint {
	method: string;
	/** With its ids filled in. */
	path: () => string;
	/** Who reaches validation. */
	who: () => string;
	/** Signed out: 401, or 200 for public reference data. */
	signedOut: number;
	/**
	 * The wrong role (403) or another gardener (404), with the status they get. A role guard answers
	 * before anything is read; a record's rule (another gardener's plant, staff reading a plant
	 * read-only) only once the body has been validated, so a bad body may be named first (400),
	 * which says nothing about the record.
	 */
	wrong?: { who: () => string; status: number; byRole: boolean };
	/** A body the route accepts from the right account, for the exact status the wrong one gets. */
	valid?: () => Record<string, unknown>;
	/** What the wrong account may get for any other body, when not just 400 or the status above. */
	anyBody?: number[];
}

const ENDPOINTS: Endpoint[] = [
	{ method: 'POST', path: () => '/api/preview', who: () => staff, signedOut: 401 },
	{ method: 'GET', path: () => '/api/v1/climates', who: () => pim, signedOut: 200 },
	{ method: 'GET', path: () => '/api/v1/cultivars', who: () => pim, signedOut: 200 },
	{ method: 'GET', path: () => '/api/v1/feeds', who: () => pim, signedOut: 401 },
	{ method: 'POST', path: () => '/api/v1/feeds', who: () => pim, signedOut: 401, wrong: { who: () => sol, status: 404, byRole: false }, valid: () => ({ plantId: ids.pimPlant }), anyBody: [201, 400, 404] },
	{ method: 'DELETE', path: () => `/api/v1/feeds/${ids.pimFeed}`, who: () => pim, signedOut: 401, wrong: { who: () => sol, status: 404, byRole: false } },
	{ method: 'POST', path: () => '/api/v1/past-sales', who: () => staff, signedOut: 401, wrong: { who: () => pim, status: 403, byRole: true } },
	{ method: 'GET', path: () => '/api/v1/plants', who: () => staff, signedOut: 401 },
	{ method: 'GET', path: () => '/api/v1/plants.csv', who: () => staff, signedOut: 401, wrong: { who: () => pim, status: 403, byRole: true } },
	{ method: 'GET', path: () => `/api/v1/plants/${ids.pimPlant}`, who: () => pim, signedOut: 401, wrong: { who: () => sol, status: 404, byRole: false } },
	{ method: 'PATCH', path: () => `/api/v1/plants/${ids.pimPlant}`, who: () => pim, signedOut: 401, wrong: { who: () => staff, status: 403, byRole: false }, valid: () => ({ units: 'imperial' }) },
	{ method: 'PATCH', path: () => `/api/v1/plants/${ids.pimPlant}`, who: () => pim, signedOut: 401, wrong: { who: () => sol, status: 404, byRole: false }, valid: () => ({ archived: true }) },
	{ method: 'POST', path: () => `/api/v1/plants/${ids.pimPlant}/milestones`, who: () => pim, signedOut: 401, wrong: { who: () => sol, status: 404, byRole: false }, valid: () => ({ kind: 'leaves', on: today, leaves: 8 }) },
	{ method: 'POST', path: () => `/api/v1/plants/${ids.pimPlant}/milestones`, who: () => pim, signedOut: 401, wrong: { who: () => staff, status: 403, byRole: false }, valid: () => ({ kind: 'leaves', on: today, leaves: 8 }) },
	{ method: 'PATCH', path: () => `/api/v1/plants/${ids.pimPlant}/milestones/${ids.pimMilestone}`, who: () => pim, signedOut: 401, wrong: { who: () => staff, status: 403, byRole: false }, valid: () => ({ note: 'Not mine' }) },
	{ method: 'PATCH', path: () => `/api/v1/plants/${ids.pimPlant}/milestones/${ids.pimMilestone}`, who: () => pim, signedOut: 401, wrong: { who: () => sol, status: 404, byRole: false }, valid: () => ({ note: 'Not mine' }) },
	{ method: 'DELETE', path: () => `/api/v1/plants/${ids.pimPlant}/milestones/${ids.pimMilestone}`, who: () => pim, signedOut: 401, wrong: { who: () => sol, status: 404, byRole: false } },
	{ method: 'POST', path: () => '/api/v1/sales', who: () => staff, signedOut: 401, wrong: { who: () => pim, status: 403, byRole: true } },
	{ method: 'DELETE', path: () => `/api/v1/sales/${ids.oldSale}`, who: () => staff, signedOut: 401, wrong: { who: () => pim, status: 403, byRole: true } },
	{ method: 'GET', path: () => '/api/v1/stock', who: () => staff, signedOut: 401, wrong: { who: () => pim, status: 403, byRole: true } },
	{ method: 'POST', path: () => '/api/v1/stock', who: () => owner, signedOut: 401, wrong: { who: () => staff, status: 403, byRole: true } }
];
const label = (e: Endpoint) => `${e.method} ${e.path().replace(/\/\d+/g, '/[id]')}`;

/** Any body at all: a JSON value of any shape, text that is not JSON, bytes that are not UTF-8, and the wrong content type. */
const rawBody = fc.oneof(
	fc.jsonValue().map((v) => ({ body: toJson(v), type: JSON_TYPE })),
	fc.string({ unit: 'binary' }).map((body) => ({ body, type: JSON_TYPE })),
	fc.constantFrom(
		'{',
		'{"a":',
		'[1,2',
		'1e309',
		'-1',
		'2147483648',
		'"\\u0000"',
		'{"__proto__":{"role":"owner"}}',
		'{"constructor":{"prototype":{"role":"owner"}}}',
		'\uFEFF{}',
		'{}\u0000',
		'['.repeat(50_000) + ']'.repeat(50_000),
		`{"markdown":"${'x'.repeat(600_000)}"}`
	).map((body) => ({ body, type: JSON_TYPE })),
	fc.uint8Array({ maxLength: 200 }).map((body) => ({ body, type: JSON_TYPE })),
	fc.record({
		body: fc.oneof(fc.string(), fc.constant('a=1&plantId=1&__proto__=x')),
		type: fc.constantFrom('text/plain', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x', 'text/csv', 'application/json; charset=utf-16', 'application/jsonx', 'application/vnd.bunchline+json', '', 'APPLICATION/JSON', 'application/xml')
	})
);

describe('ASVS 1.2.5 any raw body to every endpoint and method (signed in)', () => {
	for (const e of ENDPOINTS.filter((e, i) => ENDPOINTS.findIndex((o) => label(o) === label(e)) === i)) {
		it(`${label(e)}: never a 5xx, a refusal changes no row`, async () => {
			await fc.assert(
				fc.asyncProperty(rawBody, async ({ body, type }) => {
					await expectSafe({ method: e.method, path: e.path(), cookie: e.who(), body, type });
				}),
				{ numRuns: 12 }
			);
		});
	}
});

/** A path segment that is not a plain id: huge, negative, not a number, or spelled oddly. */
const oddId = fc.oneof(
	fc.constantFrom('0', '-1', String(ID_MAX + 1), String(ID_MAX), '99999999999999999999', '1e3', '1.5', '0x10', '01', ' 1', '1 ', 'NaN', 'Infinity', 'null', '%00', '1\u0000', '..', '\u0661', '\uFF11', '\u{1D7D9}'),
	fc.integer().map(String),
	fc.bigInt({ min: 2n ** 31n, max: 2n ** 70n }).map(String),
	fc.string({ unit: 'binary', maxLength: 30 }),
	fc.string({ minLength: 500, maxLength: 3000 })
);
const segment = (raw: string) => encodeURIComponent(raw);

interface IdRoute {
	method: string;
	path: (id: string) => string;
	who: () => string;
	/** Ids of things the caller may not reach (another gardener's): 404, and they stay as they were. */
	others: () => number[];
	body?: () => Record<string, unknown>;
}

const ID_ROUTES: IdRoute[] = [
	{ method: 'GET', path: (id) => `/api/v1/plants/${id}`, who: () => pim, others: () => [ids.solPlant] },
	{ method: 'PATCH', path: (id) => `/api/v1/plants/${id}`, who: () => pim, others: () => [ids.solPlant], body: () => ({ units: 'imperial' }) },
	{ method: 'POST', path: (id) => `/api/v1/plants/${id}/milestones`, who: () => pim, others: () => [ids.solPlant], body: () => ({ kind: 'leaves', on: today, leaves: 8 }) },
	{ method: 'PATCH', path: (id) => `/api/v1/plants/${ids.pimPlant}/milestones/${id}`, who: () => pim, others: () => [ids.solMilestone], body: () => ({ note: 'Moved' }) },
	{ method: 'PATCH', path: (id) => `/api/v1/plants/${id}/milestones/${ids.pimMilestone}`, who: () => pim, others: () => [ids.solPlant], body: () => ({ note: 'Moved' }) },
	{ method: 'DELETE', path: (id) => `/api/v1/plants/${ids.pimPlant}/milestones/${id}`, who: () => pim, others: () => [ids.solMilestone] },
	{ method: 'DELETE', path: (id) => `/api/v1/plants/${id}/milestones/${ids.pimMilestone}`, who: () => pim, others: () => [ids.solPlant] },
	{ method: 'DELETE', path: (id) => `/api/v1/feeds/${id}`, who: () => pim, others: () => [ids.solFeed] },
	{ method: 'DELETE', path: (id) => `/api/v1/sales/${id}`, who: () => staff, others: () => [ids.oldSale] }
];

describe('ASVS 1.2.5 / 8.2.2 odd ids in the path, and other people\'s', () => {
	for (const r of ID_ROUTES) {
		const name = `${r.method} ${r.path('[id]').replace(/\/\d+/g, '/[n]')}`;
		it(`${name}: never a 5xx; another gardener's id is refused; a refusal changes no row`, async () => {
			for (const other of r.others()) {
				await expectSafe({ method: r.method, path: r.path(String(other)), cookie: r.who(), type: JSON_TYPE, body: r.body ? toJson(r.body()) : undefined }, [404, 409]);
			}
			await fc.assert(
				fc.asyncProperty(oddId, async (id) => {
					await expectSafe({ method: r.method, path: r.path(segment(id)), cookie: r.who(), type: JSON_TYPE, body: r.body ? toJson(r.body()) : undefined });
				}),
				{ numRuns: 20 }
			);
		});
	}
});

/** Query strings: the known keys with right, wrong and repeated values, unknown keys, and text that is hardly a query at all. */
function queryOf(choices: Record<string, readonly string[]>): fc.Arbitrary<string> {
	const value = (k: string) => fc.oneof(fc.constantFrom(...(choices[k] ?? ['1'])), nastyText, fc.constantFrom('0', '-1', String(ID_MAX + 1), '1e309', '1.5', 'NaN'));
	const pairs = fc.array(fc.oneof(fc.constantFrom(...Object.keys(choices)).chain((k) => value(k).map((v) => [k, v] as const)), fc.tuple(extraKey, nastyText)), { maxLength: 6 });
	const latin1 = fc.string({ unit: fc.integer({ min: 0x21, max: 0xff }).filter((c) => c !== 0x23).map((c) => String.fromCharCode(c)), maxLength: 60 });
	return fc.oneof(
		{ weight: 4, arbitrary: pairs.map((p) => new URLSearchParams(p.map(([k, v]) => [k, v])).toString()) },
		{ weight: 1, arbitrary: fc.oneof(latin1, fc.constantFrom('%', '%zz', '%00', '&&==&', 'page=1&page=2', 'page[]=1', 'page=%EF%BF%BD', 'sort=__proto__', 'a=1;b=2')) }
	);
}

const TABLE_CHOICES: Record<string, readonly string[]> = {
	cultivar: cultivars.map((c) => c.slug),
	stage: TABLE_STAGES,
	market: ['1', '2'],
	claimed: ['yes', 'no'],
	overdue: ['yes', 'no'],
	sort: PLANT_SORTS,
	order: ['asc', 'desc'],
	page: ['1', '2', '400'],
	perPage: ['10', '100']
};
const QUERY_ROUTES: { path: string; as: string; who: () => string; choices: Record<string, readonly string[]> }[] = [
	{ path: '/api/v1/plants', as: 'staff', who: () => staff, choices: TABLE_CHOICES },
	{ path: '/api/v1/plants', as: 'a gardener', who: () => pim, choices: TABLE_CHOICES },
	{ path: '/api/v1/plants.csv', as: 'staff', who: () => staff, choices: TABLE_CHOICES },
	{ path: '/api/v1/stock', as: 'staff', who: () => staff, choices: { page: ['1', '2', '100000'], size: ['5', '25', '100'] } },
	{ path: '/api/v1/feeds', as: 'a gardener', who: () => pim, choices: { page: ['1'] } },
	{ path: '/api/v1/climates', as: 'a gardener', who: () => pim, choices: { page: ['1'] } },
	{ path: '/api/v1/cultivars', as: 'a gardener', who: () => pim, choices: { page: ['1'] } }
];

describe('ASVS 1.2.5 odd query strings: pagination, filters, sort', () => {
	it('the table query keys fuzzed below are the schema\'s', () => {
		expect(Object.keys(TABLE_CHOICES).sort()).toEqual(schemaKeys(plantTableQuerySchema).sort());
	});
	for (const q of QUERY_ROUTES) {
		it(`GET ${q.path} as ${q.as}: 200 or 4xx, never a 5xx`, async () => {
			await fc.assert(
				fc.asyncProperty(queryOf(q.choices), async (query) => {
					// 431: Node refuses a request line over its 16 KB header limit before the app sees it.
					await expectSafe({ method: 'GET', path: `${q.path}?${query}`, cookie: q.who() }, [200, 400, 431]);
				}),
				{ numRuns: 20 }
			);
		});
	}
});

describe('ASVS 8.2.1 / 8.2.2 signed out, the wrong role and another gardener, with any body', () => {
	for (const e of ENDPOINTS) {
		const wrong = e.wrong;
		it(`${label(e)}: signed out ${e.signedOut}${wrong ? `, ${wrong.status} to ${wrong.byRole ? 'the wrong role' : 'an account without the record\'s right'}` : ''}; nothing changes`, async () => {
			if (wrong) {
				const body = e.valid ? toJson(e.valid()) : undefined;
				await expectSafe({ method: e.method, path: e.path(), cookie: wrong.who(), body, type: JSON_TYPE }, [wrong.status]);
			}
			await fc.assert(
				fc.asyncProperty(rawBody, async ({ body, type }) => {
					const sent = { method: e.method, path: e.path(), body, type };
					// The guard answers before any body is read; public reference data ignores it.
					await expectSafe(sent, [e.signedOut]);
					// Sol's own feed of all his plants ({}) is his to make: the body, not the path, names the record there.
					if (wrong) await expectSafe({ ...sent, cookie: wrong.who() }, e.anyBody ?? (wrong.byRole ? [wrong.status] : [400, wrong.status]));
				}),
				{ numRuns: 5 }
			);
		});
	}
});

describe('ASVS 2.2.1 the odd inputs that answered 500', () => {
	const refused = async (sent: Sent, field: string) => {
		const answer = await expectSafe(sent, [400]);
		expect(JSON.stringify(JSON.parse(answer.text).error.issues)).toContain(field);
	};
	it('a NUL byte in a milestone note is a 400 beside the note, logged or corrected', async () => {
		const plant = `/api/v1/plants/${ids.pimPlant}`;
		await refused({ method: 'POST', path: `${plant}/milestones`, cookie: pim, type: JSON_TYPE, body: toJson({ kind: 'leaves', on: ids.pimPlantedOn, leaves: 9, note: 'Two new\u0000 leaves' }) }, 'note');
		const [{ id }] = [...(await db.execute<{ id: number }>(sql`select id from milestones where plant_id = ${ids.pimPlant} order by id limit 1`))];
		await refused({ method: 'PATCH', path: `${plant}/milestones/${id}`, cookie: pim, type: JSON_TYPE, body: toJson({ note: 'Recounted\u0000' }) }, 'note');
	});
	it('a NUL byte after a cultivar slug on receiving stock is a 400 beside the cultivar', async () => {
		await refused({ method: 'POST', path: '/api/v1/stock', cookie: owner, type: JSON_TYPE, body: toJson({ cultivar: `${cultivars[0].slug}\u0000`, count: 3, pottedOn: today }) }, 'cultivar');
	});
	it('a NUL byte in the market column of past sales is a 400 naming the row and column', async () => {
		const row = VALID_PAST_SALE.map((v, i) => (PAST_SALE_COLUMNS[i] === 'market' ? `${v}\u0000` : v));
		await refused({ method: 'POST', path: '/api/v1/past-sales', cookie: staff, type: 'text/csv', body: [PAST_SALE_COLUMNS.join(','), row.join(',')].join('\r\n') }, 'market');
	});
});

// ---------------------------------------------------------------------------------------------
// The public plan preview, called in the process (no session, nothing stored).

const date = fc.oneof(
	fc.date({ min: new Date('1890-01-01'), max: new Date('2250-12-31'), noInvalidDate: true }).map((d) => d.toISOString().slice(0, 10)),
	fc.constantFrom('2027-02-30', '2027-13-01', '27-01-01', '', 'tomorrow', '2027-1-1')
);
const climate = fc.oneof(
	fc.constantFrom(...climates.map((c) => c.slug), 'nowhere'),
	fc.record({ monthlyMeanC: fc.array(fc.oneof(fc.double({ min: -60, max: 70 }), fc.string()), { minLength: 10, maxLength: 13 }) })
);
const nearlyValid = fc.record(
	{
		cultivar: fc.oneof(fc.constantFrom(...cultivars.map((c) => c.slug)), fc.string()),
		plantedOn: date,
		ageAtPlantingWeeks: fc.oneof(fc.integer({ min: -10, max: 120 }), fc.double(), fc.string()),
		climate,
		units: fc.constantFrom('metric', 'imperial', 'furlongs'),
		observed: fc.record({ shotOn: date, harvestedOn: date }, { requiredKeys: [] })
	},
	{ requiredKeys: [] }
);

describe('ASVS 2.2.1 plan preview under arbitrary input', () => {
	it('nearly valid bodies get 200 or 400', async () => {
		await fc.assert(
			fc.asyncProperty(nearlyValid, async (body) => {
				const res = await postJson(POST as never, '/api/v1/plan-preview', body);
				expect([200, 400]).toContain(res.status);
				const json = await res.json();
				if (res.status === 400) expect(json.error.issues.length).toBeGreaterThan(0);
				else expect(Array.isArray(json.steps)).toBe(true);
			}),
			{ numRuns: 300 }
		);
	});

	it('any JSON value or raw text gets 400, never a 500', async () => {
		await fc.assert(
			fc.asyncProperty(fc.oneof(fc.jsonValue().map((v) => JSON.stringify(v)), fc.string()), async (raw) => {
				const res = await call(POST as never, '/api/v1/plan-preview', { method: 'POST', headers: { 'content-type': 'application/json' }, body: raw });
				expect([200, 400]).toContain(res.status);
			}),
			{ numRuns: 300 }
		);
	});

	it('the calendar route takes any query string without a 500', async () => {
		await fc.assert(
			fc.asyncProperty(nearlyValid, async (body) => {
				const q = new URLSearchParams();
				for (const [k, v] of Object.entries(body)) {
					if (k === 'climate' && typeof v === 'object') q.set('monthlyMeanC', (v as { monthlyMeanC: unknown[] }).monthlyMeanC.join(','));
					else if (k === 'observed') for (const [ok, ov] of Object.entries(v as object)) q.set(ok, String(ov));
					else q.set(k, String(v));
				}
				const res = await call(GET_ICS as never, `/api/v1/plan-preview.ics?${q}`);
				expect([200, 400]).toContain(res.status);
			}),
			{ numRuns: 200 }
		);
	});

	it('the valid body still plans', async () => {
		expect((await postJson(POST as never, '/api/v1/plan-preview', validBody)).status).toBe(200);
	});
});
