// ASVS 5.0 V8.2.2 (data-specific access: a user reaches only their own records) and V2.2.1 (input
// validated before use): every plant route and endpoint, asked by another gardener, answers 404
// and changes nothing; bad input gets a 400 naming the field and writes nothing.
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../scripts/seed';
import { DEMO_ACCOUNTS } from '../../scripts/demo.mjs';
import { db } from '../../src/lib/server/db';
import { milestones, planSteps, plants, users } from '../../src/lib/server/db/schema';
import { plantService } from '../../src/lib/server/plants/plant-service';
import { baseUrl } from '../helpers/browser';
import { sessionCookie } from '../helpers/session';
import { phonePhotoWithGps } from '../helpers/images';
import { insertPlant } from '../helpers/plants';

const isoDaysAfter = (iso: string, days: number) => new Date(Date.parse(iso) + days * 86_400_000).toISOString().slice(0, 10);
const today = new Date().toISOString().slice(0, 10);


const request = (cookie: string, method: string, path: string, body?: unknown, form?: URLSearchParams | FormData) =>
	fetch(`${baseUrl()}${path}`, {
		method,
		redirect: 'manual',
		headers: {
			cookie,
			origin: baseUrl(),
			accept: form ? 'text/html' : 'application/json',
			...(body !== undefined ? { 'content-type': 'application/json' } : {}),
			...(form instanceof URLSearchParams ? { 'content-type': 'application/x-www-form-urlencoded' } : {})
		},
		body: body !== undefined ? JSON.stringify(body) : form
	});

let pim: string, sol: string, ines: string;
let plantId: number, milestoneId: number, photoId: number;
const snapshot = async () => ({
	plant: (await db.select().from(plants).where(eq(plants.id, plantId)))[0],
	milestones: await db.select().from(milestones).where(eq(milestones.plantId, plantId)),
	steps: await db.select().from(planSteps).where(eq(planSteps.plantId, plantId))
});

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	const [owner] = await db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS[3]!.email));
	plantId = (await insertPlant({ gardenerId: owner!.id, plantedOn: isoDaysAfter(today, -300) })).id;
	const photo = new File([new Uint8Array(await phonePhotoWithGps(200, 150))], 'a.jpg', { type: 'image/jpeg' });
	const logged = await plantService.log(owner!, plantId, { kind: 'flag-leaf', on: isoDaysAfter(today, -30), generation: 0 }, photo);
	milestoneId = logged.milestone.id;
	photoId = logged.milestone.photoId!;
	[pim, sol, ines] = await Promise.all([DEMO_ACCOUNTS[3], DEMO_ACCOUNTS[4], DEMO_ACCOUNTS[1]].map((a) => sessionCookie(a!.email)));
});

describe('ASVS V8.2.2: another gardener’s plant, milestone and photo do not exist for you', () => {
	const cases = (): [string, string, unknown?, URLSearchParams?][] => [
		['GET', `/plants/${plantId}`],
		['GET', `/plants/${plantId}/log`],
		['POST', `/plants/${plantId}?/settings`, undefined, new URLSearchParams({ plantedOn: today, climate: 'south-florida-coast', units: 'metric' })],
		['POST', `/plants/${plantId}?/archive`, undefined, new URLSearchParams({ archived: 'true' })],
		['POST', `/plants/${plantId}/log?/log`, undefined, new URLSearchParams({ kind: 'shooting', on: today })],
		['POST', `/plants/${plantId}/log?/correct`, undefined, new URLSearchParams({ milestoneId: String(milestoneId), note: 'mine' })],
		['POST', `/plants/${plantId}/log?/delete`, undefined, new URLSearchParams({ milestoneId: String(milestoneId) })],
		['GET', `/uploads/${photoId}/thumbnail`],
		['GET', `/uploads/${photoId}/display`],
		['GET', `/api/v1/plants/${plantId}`],
		['PATCH', `/api/v1/plants/${plantId}`, { archived: true }],
		['POST', `/api/v1/plants/${plantId}/milestones`, { kind: 'shooting', on: today }],
		['PATCH', `/api/v1/plants/${plantId}/milestones/${milestoneId}`, { note: 'mine' }],
		['DELETE', `/api/v1/plants/${plantId}/milestones/${milestoneId}`]
	];

	it('every route and endpoint answers 404 and nothing changes', async () => {
		const before = await snapshot();
		for (const [method, path, body, form] of cases()) {
			const res = await request(sol, method, path, body, form);
			expect(res.status, `${method} ${path}`).toBe(404);
		}
		expect(await snapshot()).toEqual(before);
	});

	it('the gardener reaches each of them', async () => {
		for (const [method, path] of cases().filter(([m]) => m === 'GET')) {
			expect((await request(pim, method, path)).status, path).toBe(200);
		}
	});

	it('a milestone id of another plant is 404 through this plant', async () => {
		const [solUser] = await db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS[4]!.email));
		const solPlant = (await insertPlant({ gardenerId: solUser!.id, plantedOn: isoDaysAfter(today, -300) })).id;
		expect((await request(sol, 'PATCH', `/api/v1/plants/${solPlant}/milestones/${milestoneId}`, { note: 'x' })).status).toBe(404);
		expect((await request(sol, 'DELETE', `/api/v1/plants/${solPlant}/milestones/${milestoneId}`)).status).toBe(404);
	});

	it('staff read the plant and its photo but cannot change it (403)', async () => {
		expect((await request(ines, 'GET', `/api/v1/plants/${plantId}`)).status).toBe(200);
		expect((await request(ines, 'GET', `/uploads/${photoId}/thumbnail`)).status).toBe(200);
		const before = await snapshot();
		expect((await request(ines, 'PATCH', `/api/v1/plants/${plantId}`, { archived: true })).status).toBe(403);
		expect((await request(ines, 'POST', `/api/v1/plants/${plantId}/milestones`, { kind: 'shooting', on: today })).status).toBe(403);
		expect(await snapshot()).toEqual(before);
	});
});

describe('ASVS V2.2.1: bad input is refused with the field named, and nothing is written', () => {
	const refusals: [string, string, unknown, (string | number)[]][] = [
		['POST', 'milestones', { kind: 'bloomed', on: '2026-01-01' }, ['kind']],
		['POST', 'milestones', { kind: 'shooting', on: '2026-02-30' }, ['on']],
		['POST', 'milestones', { kind: 'shooting', on: '2100-01-01' }, ['on']],
		['POST', 'milestones', { kind: 'leaves', on: '2026-01-01' }, ['leaves']],
		['POST', 'milestones', { kind: 'harvest', on: '2026-01-01', hands: 2.5 }, ['hands']],
		['POST', 'milestones', { kind: 'lost', on: '2026-01-01', reason: 'aliens' }, ['reason']],
		['POST', 'milestones', { kind: 'shooting', on: '2026-01-01', note: 'x'.repeat(1001) }, ['note']],
		['PATCH', '', { plantedOn: 'soon' }, ['plantedOn']],
		['PATCH', '', { climate: { monthlyMeanC: [1, 2] } }, ['climate']],
		['PATCH', '', { units: 'cubits' }, ['units']],
		['PATCH', '', {}, []],
		['PATCH', '', { gardenerId: 5 }, []]
	];
	for (const [method, sub, body, path] of refusals) {
		it(`${method} ${JSON.stringify(body).slice(0, 60)} → 400 at ${JSON.stringify(path)}`, async () => {
			const before = await snapshot();
			const res = await request(pim, method, `/api/v1/plants/${plantId}${sub ? `/${sub}` : ''}`, body);
			expect(res.status).toBe(400);
			const json = (await res.json()) as { error: { issues: { path: (string | number)[]; message: string }[] } };
			expect(json.error.issues.some((i) => JSON.stringify(i.path.slice(0, path.length)) === JSON.stringify(path))).toBe(true);
			expect(json.error.issues.every((i) => i.message.length > 0)).toBe(true);
			expect(await snapshot()).toEqual(before);
		});
	}

	it('a body that is not JSON is a 400, not a write', async () => {
		const res = await fetch(`${baseUrl()}/api/v1/plants/${plantId}/milestones`, { method: 'POST', headers: { cookie: pim, origin: baseUrl(), 'content-type': 'text/plain' }, body: 'kind=shooting' });
		expect(res.status).toBe(400);
	});

	it('the API logs a milestone and answers with the plant, its steps with uids and what moved', async () => {
		const res = await request(pim, 'POST', `/api/v1/plants/${plantId}/milestones`, { kind: 'shooting', on: isoDaysAfter(today, -5), note: 'by API' });
		expect(res.status).toBe(201);
		const body = (await res.json()) as { milestone: { id: number; kind: string }; moved: { kind: string; days: number; uid: string }[]; steps: { uid: string; kind: string }[]; plant: { lastMilestone: { kind: string } } };
		expect(body.milestone.kind).toBe('shooting');
		expect(body.plant.lastMilestone.kind).toBe('shooting');
		const harvest = body.moved.find((m) => m.kind === 'harvest');
		expect(harvest?.days).not.toBe(0);
		expect(body.steps.find((s) => s.uid === harvest!.uid)?.kind).toBe('harvest');
		const del = await request(pim, 'DELETE', `/api/v1/plants/${plantId}/milestones/${body.milestone.id}`);
		expect(del.status).toBe(200);
		expect(((await del.json()) as { moved: { uid: string; days: number }[] }).moved.find((m) => m.uid === harvest!.uid)?.days).toBe(-harvest!.days);
	});
});
