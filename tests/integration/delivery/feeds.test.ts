/**
 * Calendar feeds end to end through their route handlers, against the test database: tokens,
 * the iCalendar they serve (read back with ical.js), conditional GETs, revocation and scope.
 */
import { eq, sql } from 'drizzle-orm';
import ICAL from 'ical.js';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../../src/lib/server/db';
import { calendarFeeds, planSteps, plants } from '../../../src/lib/server/db/schema';
import { createFeedService, feeds } from '../../../src/lib/server/feeds/service';
import { feedRepository } from '../../../src/lib/server/feeds/repository';
import { GET as getFeed } from '../../../src/routes/feeds/[token].ics/+server';
import { GET as listFeeds, POST as postFeed } from '../../../src/routes/api/v1/feeds/+server';
import { DELETE as deleteFeed } from '../../../src/routes/api/v1/feeds/[id]/+server';
import { insertGardener, insertPlant, moveStep, pinChangeTime } from '../../helpers/plants';
import { issuePaths } from '../api/helpers';
import { plantService } from '../../../src/lib/server/plants/plant-service';

type Handler = (event: never) => Response | Promise<Response>;
type User = { id: number; role: 'gardener'; name: string; email: string };

function call(handler: Handler, path: string, init: RequestInit & { user?: User; params?: Record<string, string> } = {}) {
	const url = new URL(path, 'http://bunchline.test');
	const { user, params, ...rest } = init;
	return Promise.resolve(handler({ request: new Request(url, rest), url, params: params ?? {}, locals: { user: user ?? null } } as never));
}
const postJson = (user: User | undefined, body: unknown) =>
	call(postFeed, '/api/v1/feeds', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body), user });
const tokenOf = (url: string) => new URL(url).pathname.replace(/^\/feeds\//, '').replace(/\.ics$/, '');
const fetchFeed = (token: string, headers: Record<string, string> = {}) => call(getFeed, `/feeds/${token}.ics`, { headers, params: { token } });

/** Each event of a calendar (read with ical.js) by UID: its start day and SEQUENCE. */
function eventsOf(ics: string): Map<string, { start: string; sequence: number }> {
	const events = new ICAL.Component(ICAL.parse(ics)).getAllSubcomponents('vevent');
	return new Map(events.map((e) => [String(e.getFirstPropertyValue('uid')), { start: String(e.getFirstPropertyValue('dtstart')), sequence: Number(e.getFirstPropertyValue('sequence')) }]));
}

let pim: User;
let sol: User;
let plantId: number;
let otherPlantId: number;

beforeAll(async () => {
	const a = await insertGardener('Pim');
	const b = await insertGardener('Sol');
	pim = { id: a.id, role: 'gardener', name: 'Pim', email: a.email };
	sol = { id: b.id, role: 'gardener', name: 'Sol', email: b.email };
	plantId = (await insertPlant({ gardenerId: pim.id, plantedOn: '2026-03-01' })).id;
	await pinChangeTime(plantId, new Date('2026-02-20T10:00:00Z'));
	await insertPlant({ gardenerId: pim.id, plantedOn: '2026-04-01' });
	otherPlantId = (await insertPlant({ gardenerId: sol.id })).id;
});

describe('creating a feed', () => {
	it('answers 201 with an https and a webcal URL whose token has at least 128 random bits and is stored only as a hash', async () => {
		const res = await postJson(pim, { plantId });
		expect(res.status).toBe(201);
		const body = (await res.json()) as { id: number; url: string; webcal: string };
		const token = tokenOf(body.url);
		expect(token).toMatch(/^[a-z2-7]{32}$/); // 32 base32 characters = 160 bits
		expect(body.webcal).toBe(body.url.replace(/^http:/, 'webcal:'));
		const stored = await db.execute(sql`select count(*)::int as n from calendar_feeds where token_hash = ${token} or ics like ${'%' + token + '%'}`);
		expect(stored[0].n).toBe(0);
		const [row] = await db.select().from(calendarFeeds).where(eq(calendarFeeds.id, body.id));
		expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);
	});

	it("another gardener's plant is 404 and nothing is written", async () => {
		const before = await db.$count(calendarFeeds);
		const res = await postJson(pim, { plantId: otherPlantId });
		expect(res.status).toBe(404);
		expect(await db.$count(calendarFeeds)).toBe(before);
	});

	it('bad input is a 400 naming the field; a body that is not JSON is refused', async () => {
		expect(await issuePaths(await postJson(pim, { plantId: 'seven' }))).toEqual(['plantId']);
		expect(await issuePaths(await postJson(pim, { plantId: 1, extra: true }))).toEqual(['']);
		const form = await call(postFeed, '/api/v1/feeds', { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: 'plantId=1', user: pim });
		expect(form.status).toBe(400);
	});

	it('signed out is 401', async () => {
		const before = await db.$count(calendarFeeds);
		const res = await postJson(undefined, {});
		expect(res.status).toBe(401);
		expect(await db.$count(calendarFeeds)).toBe(before);
	});
});

describe('serving a feed', () => {
	let token: string;
	beforeAll(async () => {
		token = tokenOf(((await (await postJson(pim, { plantId })).json()) as { url: string }).url);
	});

	it('is valid iCalendar: one event per stored step, with its UID, SEQUENCE and last change as DTSTAMP and LAST-MODIFIED', async () => {
		const res = await fetchFeed(token);
		expect(res.status).toBe(200);
		expect(res.headers.get('content-type')).toBe('text/calendar; charset=utf-8');
		expect(res.headers.get('cache-control')).toMatch(/\bprivate\b/);
		expect(res.headers.get('etag')).toMatch(/^"[\w-]+"$/);
		expect(res.headers.get('last-modified')).toBe('Fri, 20 Feb 2026 10:00:00 GMT');
		const calendar = new ICAL.Component(ICAL.parse(await res.text()));
		const events = calendar.getAllSubcomponents('vevent');
		const steps = await db.select().from(planSteps).where(eq(planSteps.plantId, plantId));
		expect(events).toHaveLength(steps.length);
		expect(steps.length).toBeGreaterThan(20);
		const byUid = new Map(steps.map((s) => [`${s.uid}@bunchline`, s]));
		for (const event of events) {
			const step = byUid.get(String(event.getFirstPropertyValue('uid')))!;
			expect(step).toBeDefined();
			expect(String(event.getFirstPropertyValue('dtstart'))).toBe(step.likely);
			expect(event.getFirstPropertyValue('sequence')).toBe(step.sequence);
			expect(String(event.getFirstPropertyValue('dtstamp'))).toBe('2026-02-20T10:00:00Z');
			expect(String(event.getFirstPropertyValue('last-modified'))).toBe('2026-02-20T10:00:00Z');
			const description = String(event.getFirstPropertyValue('description'));
			expect(description).toMatch(new RegExp(`Your plant: https?://\\S+/plants/${plantId}$`, 'm'));
			for (const caution of step.cautions ?? []) expect(description).toContain(caution);
		}
		expect(calendar.getFirstPropertyValue('x-wr-calname')).toMatch(/#\d+ · Bunchline$/);
	});

	it('a calendar polling with If-None-Match or If-Modified-Since gets 304 until the plan changes, then the moved step with a higher SEQUENCE', async () => {
		const first = await fetchFeed(token);
		const etag = first.headers.get('etag')!;
		const lastModified = first.headers.get('last-modified')!;
		expect((await fetchFeed(token, { 'if-none-match': etag })).status).toBe(304);
		expect((await fetchFeed(token, { 'if-none-match': `W/${etag}` })).status).toBe(304);
		expect((await fetchFeed(token, { 'if-modified-since': lastModified })).status).toBe(304);
		expect((await fetchFeed(token, { 'if-none-match': '"other"' })).status).toBe(200);

		const [step] = await db.select().from(planSteps).where(eq(planSteps.plantId, plantId)).orderBy(planSteps.likely).limit(1);
		await moveStep(step.id, 3, new Date('2026-03-05T09:30:00Z'));
		const after = await fetchFeed(token, { 'if-none-match': etag });
		expect(after.status).toBe(200);
		expect(after.headers.get('etag')).not.toBe(etag);
		expect(after.headers.get('last-modified')).toBe('Thu, 05 Mar 2026 09:30:00 GMT');
		expect((await fetchFeed(token, { 'if-modified-since': lastModified })).status).toBe(200);
		const moved = new ICAL.Component(ICAL.parse(await after.text()))
			.getAllSubcomponents('vevent')
			.find((e) => e.getFirstPropertyValue('uid') === `${step.uid}@bunchline`)!;
		expect(moved.getFirstPropertyValue('sequence')).toBe(step.sequence + 1);
		expect(String(moved.getFirstPropertyValue('dtstamp'))).toBe('2026-03-05T09:30:00Z');
		expect((await fetchFeed(token, { 'if-none-match': after.headers.get('etag')! })).status).toBe(304);
	});

	it('a milestone the gardener logs re-times the plan: the calendar polling with its ETag then gets 200, the re-timed steps and a new ETag', async () => {
		const before = await fetchFeed(token);
		const etag = before.headers.get('etag')!;
		const uidsBefore = eventsOf(await before.text());
		expect((await fetchFeed(token, { 'if-none-match': etag })).status).toBe(304);
		const { moved } = await plantService.log(pim, plantId, { kind: 'leaves', on: '2026-06-01', generation: 0, leaves: 30 });
		expect(moved.length).toBeGreaterThan(0);
		const after = await fetchFeed(token, { 'if-none-match': etag });
		expect(after.status).toBe(200);
		expect(after.headers.get('etag')).not.toBe(etag);
		const uidsAfter = eventsOf(await after.text());
		const inFeed = moved.filter((x) => uidsAfter.has(`${x.uid}@bunchline`));
		expect(inFeed.length).toBeGreaterThan(0);
		for (const m of inFeed) {
			expect(uidsAfter.get(`${m.uid}@bunchline`)!.start).toBe(m.toLikely);
			expect(uidsAfter.get(`${m.uid}@bunchline`)!.sequence).toBeGreaterThan(uidsBefore.get(`${m.uid}@bunchline`)?.sequence ?? -1);
		}
		expect((await fetchFeed(token, { 'if-none-match': after.headers.get('etag')! })).status).toBe(304);
	});

	it('stored bytes are served: polls render the calendar once per plan change, not per request', async () => {
		let renders = 0;
		const counting = createFeedService({ ...feedRepository, steps: (f) => (renders++, feedRepository.steps(f)) }, () => 'http://bunchline.test');
		const a = await counting.fetch(token, null, null);
		const b = await counting.fetch(token, null, null);
		expect(a.body).toBe(b.body);
		expect(renders).toBe(0); // rendered and stored by the previous test's poll
		await db.update(plants).set({ planChangedAt: new Date('2026-03-06T00:00:00Z') }).where(eq(plants.id, plantId));
		await counting.fetch(token, null, null);
		await counting.fetch(token, null, null);
		expect(renders).toBe(1);
	});

	it("a revoked token, a random token and a malformed one are 404; a plant that left the gardener's hands is 404", async () => {
		expect((await fetchFeed('a'.repeat(32))).status).toBe(404);
		expect((await fetchFeed('../../etc/passwd')).status).toBe(404);
		const other = (await (await postJson(sol, { plantId: otherPlantId })).json()) as { id: number; url: string };
		const otherToken = tokenOf(other.url);
		expect((await fetchFeed(otherToken)).status).toBe(200);
		await db.update(plants).set({ gardenerId: pim.id }).where(eq(plants.id, otherPlantId));
		expect((await fetchFeed(otherToken)).status).toBe(404);
		await db.update(plants).set({ gardenerId: sol.id }).where(eq(plants.id, otherPlantId));

		const res = await call(deleteFeed, `/api/v1/feeds/${other.id}`, { method: 'DELETE', params: { id: String(other.id) }, user: sol });
		expect(res.status).toBe(204);
		expect((await fetchFeed(otherToken)).status).toBe(404);
	});
});

describe('listing and revoking', () => {
	it('lists the gardener\'s live feeds without tokens or hashes', async () => {
		const all = (await (await postJson(pim, {})).json()) as { id: number; url: string };
		const res = await call(listFeeds, '/api/v1/feeds', { user: pim });
		const text = await res.text();
		expect(text).not.toContain(tokenOf(all.url));
		expect(text).not.toMatch(/token|hash/i);
		const body = JSON.parse(text) as { feeds: { id: number; plantId: number | null; scope: string }[] };
		expect(body.feeds.find((f) => f.id === all.id)).toMatchObject({ plantId: null, scope: 'All my plants' });
		expect(body.feeds.every((f) => f.id > 0)).toBe(true);
	});

	it('the all-plants feed holds every step of both plants, each summary naming its plant', async () => {
		const all = (await (await postJson(pim, {})).json()) as { url: string };
		const res = await fetchFeed(tokenOf(all.url));
		const events = new ICAL.Component(ICAL.parse(await res.text())).getAllSubcomponents('vevent');
		const [{ n }] = await db.execute<{ n: number }>(sql`select count(*)::int as n from plan_steps s join plants p on p.id = s.plant_id where p.gardener_id = ${pim.id}`);
		expect(events).toHaveLength(n);
		expect(events.every((e) => / · .+ #\d+$/.test(String(e.getFirstPropertyValue('summary'))))).toBe(true);
	});

	it("revoking another gardener's feed is 404 and leaves it working; a bad id is 400", async () => {
		const sols = (await (await postJson(sol, {})).json()) as { id: number; url: string };
		const res = await call(deleteFeed, `/api/v1/feeds/${sols.id}`, { method: 'DELETE', params: { id: String(sols.id) }, user: pim });
		expect(res.status).toBe(404);
		expect((await fetchFeed(tokenOf(sols.url))).status).toBe(200);
		expect(await issuePaths(await call(deleteFeed, '/api/v1/feeds/x', { method: 'DELETE', params: { id: 'x' }, user: pim }))).toEqual(['id']);
	});

	it('rotating gives a new URL and ends the old one', async () => {
		const first = await feeds.create(pim.id, plantId);
		const second = await feeds.rotate(pim.id, first.id);
		expect((await fetchFeed(tokenOf(first.https))).status).toBe(404);
		expect((await fetchFeed(tokenOf(second.https))).status).toBe(200);
		await expect(feeds.rotate(sol.id, second.id)).rejects.toMatchObject({ status: 404 });
	});
});
