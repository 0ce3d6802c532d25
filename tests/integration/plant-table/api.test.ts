import { parse } from 'csv-parse/sync';
import { beforeAll, describe, expect, it } from 'vitest';
import { TABLE_ROW_LIMIT } from '../../../src/lib/schema/plant-table';
import { makePlantTableService } from '../../../src/lib/server/plant-table/service';
import { plantTableRepository } from '../../../src/lib/server/plant-table/repository';
import { GET as listPlants } from '../../../src/routes/api/v1/plants/+server';
import { GET as exportPlants } from '../../../src/routes/api/v1/plants.csv/+server';
import { insertPlants, testCultivar, testMarketDay, testUser } from '../../helpers/plant-rows';

type User = { id: number; role: 'owner' | 'staff' | 'gardener'; name: string };
type Handler = (event: never) => Response | Promise<Response>;

function call(handler: Handler, path: string, user: User | null): Promise<Response> {
	const url = new URL(path, 'http://bunchline.test');
	return Promise.resolve(handler({ request: new Request(url), url, locals: { user, session: null } } as never));
}

async function list(query: string, user: User) {
	const res = await call(listPlants, `/api/v1/plants?${query}`, user);
	expect(res.status, await res.clone().text()).toBe(200);
	return res.json();
}

async function issues(res: Response) {
	expect(res.status).toBe(400);
	const body = await res.json();
	return body.error.issues.map((i: { path: string[] }) => i.path.join('.'));
}

let staff: User;
let gardener: User;
let otherGardener: User;
let cultivar: { id: number; slug: string };
let other: { id: number; slug: string };
let marketId: number;
let ids: Record<string, number>;

beforeAll(async () => {
	[staff, gardener, otherGardener] = await Promise.all([testUser('staff'), testUser('gardener', 'Pim Tester'), testUser('gardener', '=HYPERLINK("http://x")')]);
	[cultivar, other] = await Promise.all([testCultivar('Table Test Nain'), testCultivar('Other Test Lady')]);
	marketId = (await testMarketDay('2026-03-07')).id;
	const rows = await insertPlants([
		{ cultivarId: cultivar.id, soldOn: '2026-03-07', marketDayId: marketId, gardenerId: gardener.id, stage: 'growing-leaves', nextStepOn: '2020-01-10', nextStepKind: 'feeding', ageAtSaleWeeks: 10 },
		{ cultivarId: cultivar.id, soldOn: '2026-03-07', marketDayId: marketId, gardenerId: otherGardener.id, stage: 'flowering', nextStepOn: '2099-02-01', nextStepKind: 'bud-removal', lastMilestoneOn: '2026-09-01', lastMilestoneKind: 'shooting', ageAtSaleWeeks: 30 },
		{ cultivarId: cultivar.id, soldOn: '2026-02-01', gardenerId: gardener.id, stage: 'growing-leaves', nextStepOn: '2099-01-01', nextStepKind: 'feeding', ageAtSaleWeeks: 20 },
		{ cultivarId: cultivar.id, soldOn: '2026-01-15', ageAtSaleWeeks: 8 },
		{ cultivarId: other.id, soldOn: '2026-03-07', marketDayId: marketId, gardenerId: gardener.id, stage: 'growing-leaves', nextStepOn: '2099-03-01', nextStepKind: 'feeding' }
	]);
	ids = { overdue: rows[0].id, flowering: rows[1].id, later: rows[2].id, unclaimed: rows[3].id, otherCultivar: rows[4].id };
});

const idsOf = (body: { plants: { id: number }[] }) => body.plants.map((p) => p.id);

describe('GET /api/v1/plants for staff', () => {
	it('filters by cultivar and sorts by next step, empty dates last, with an exact total', async () => {
		const body = await list(`cultivar=${cultivar.slug}`, staff);
		expect(idsOf(body)).toEqual([ids.overdue, ids.later, ids.flowering, ids.unclaimed]);
		expect(body).toMatchObject({ total: 4, totalExact: true, page: 1, perPage: 25, pages: 1 });
		expect(body.plants[1]).toMatchObject({ href: `/plants/${ids.later}`, cultivar: { slug: cultivar.slug, name: 'Table Test Nain' }, claimed: true, gardener: 'Pim Tester', stage: 'growing-leaves' });
		expect(body.plants[3]).toMatchObject({ claimed: false, gardener: null, nextStep: null, marketDay: null });
	});

	it('filters by stage, market day, claimed and overdue', async () => {
		expect(idsOf(await list(`cultivar=${cultivar.slug}&stage=flowering`, staff))).toEqual([ids.flowering]);
		expect(idsOf(await list(`market=${marketId}`, staff)).sort()).toEqual([ids.overdue, ids.flowering, ids.otherCultivar].sort());
		expect(idsOf(await list(`cultivar=${cultivar.slug}&claimed=no`, staff))).toEqual([ids.unclaimed]);
		expect(idsOf(await list(`cultivar=${cultivar.slug}&claimed=yes`, staff))).toEqual([ids.overdue, ids.later, ids.flowering]);
		const overdue = await list(`cultivar=${cultivar.slug}&overdue=yes`, staff);
		expect(idsOf(overdue)).toEqual([ids.overdue]);
		expect(overdue.plants[0].nextStep).toEqual({ kind: 'feeding', on: '2020-01-10', overdue: true });
		expect(idsOf(await list(`cultivar=${cultivar.slug}&overdue=no`, staff))).toEqual([ids.later, ids.flowering, ids.unclaimed]);
	});

	it('sorts by sale day, age and last milestone, both ways', async () => {
		expect(idsOf(await list(`cultivar=${cultivar.slug}&sort=soldOn&order=desc`, staff))).toEqual([ids.flowering, ids.overdue, ids.later, ids.unclaimed]);
		// Oldest first: the largest age at sale and the earliest start.
		expect(idsOf(await list(`cultivar=${cultivar.slug}&sort=age&order=desc`, staff))[0]).toBe(ids.flowering);
		// Youngest first: 10 weeks old on 7 March beats 8 weeks old on 15 January.
		expect(idsOf(await list(`cultivar=${cultivar.slug}&sort=age`, staff))).toEqual([ids.overdue, ids.unclaimed, ids.later, ids.flowering]);
		expect(idsOf(await list(`cultivar=${cultivar.slug}&sort=lastMilestone`, staff))[0]).toBe(ids.flowering);
	});

	it('pages through with a total that covers every page', async () => {
		const first = await list(`cultivar=${cultivar.slug}&perPage=10&sort=soldOn`, staff);
		expect(first).toMatchObject({ total: 4, pages: 1 });
		const second = await list(`cultivar=${cultivar.slug}&perPage=10&page=2`, staff);
		expect(second.plants).toEqual([]);
		expect(second.total).toBe(4);
	});
});

describe('GET /api/v1/plants for a gardener', () => {
	it("shows only the gardener's own plants, whatever the filters ask", async () => {
		const body = await list('', gardener);
		expect(idsOf(body).sort()).toEqual([ids.overdue, ids.later, ids.otherCultivar].sort());
		expect(body.total).toBe(3);
		expect(idsOf(await list(`cultivar=${cultivar.slug}&stage=flowering`, gardener))).toEqual([]);
	});

	it('may not export the nursery CSV', async () => {
		const res = await call(exportPlants, '/api/v1/plants.csv', gardener);
		expect(res.status).toBe(403);
		expect((await res.json()).error.message).toBeTruthy();
	});
});

describe('refusals', () => {
	it('signed out: 401 in the API error shape', async () => {
		const res = await call(listPlants, '/api/v1/plants', null);
		expect(res.status).toBe(401);
		expect((await res.json()).error).toMatchObject({ issues: [] });
	});

	it('names each bad field', async () => {
		expect(await issues(await call(listPlants, '/api/v1/plants?stage=ripe-ish&perPage=5&sort=price&order=up&claimed=maybe', staff))).toEqual([
			'stage',
			'claimed',
			'sort',
			'order',
			'perPage'
		]);
		expect(await issues(await call(listPlants, '/api/v1/plants?cultivar=no-such-banana', staff))).toEqual(['cultivar']);
		expect(await issues(await call(listPlants, '/api/v1/plants?market=999999999', staff))).toEqual(['market']);
		expect(await issues(await call(listPlants, `/api/v1/plants?page=${TABLE_ROW_LIMIT}&perPage=100`, staff))).toEqual(['page']);
		expect(await issues(await call(exportPlants, '/api/v1/plants.csv?overdue=later', staff))).toEqual(['overdue']);
	});
});

describe('GET /api/v1/plants.csv', () => {
	it('streams every matching plant in the sort order, formulas neutralised', async () => {
		const res = await call(exportPlants, `/api/v1/plants.csv?cultivar=${cultivar.slug}&claimed=yes&sort=soldOn&page=1`, staff);
		expect(res.status).toBe(200);
		expect(res.headers.get('content-type')).toBe('text/csv; charset=utf-8');
		expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="bunchline-plants-\d{4}-\d{2}-\d{2}\.csv"$/);
		const text = await res.text();
		expect(text.endsWith('\r\n')).toBe(true);
		const [header, ...rows] = parse(text) as string[][];
		expect(header.slice(0, 4)).toEqual(['plant', 'cultivar', 'gardener', 'claimed']);
		expect(rows.map((r) => Number(r[0]))).toEqual([ids.later, ids.overdue, ids.flowering]);
		const flowering = rows.find((r) => Number(r[0]) === ids.flowering)!;
		// OWASP CSV injection: a cell starting with = is prefixed so a spreadsheet shows it as text.
		expect(flowering[2]).toBe(`'=HYPERLINK("http://x")`);
	});
});

describe('the total', () => {
	it('is exact up to the limit and the estimate beyond it, never below what was counted', async () => {
		const stubbed = makePlantTableService({
			repository: { ...plantTableRepository, page: async () => [], countUpTo: async (_w, cap) => cap, estimate: async () => 12_345_678 },
			today: async () => '2026-06-01'
		});
		const page = await stubbed.list({ sort: 'nextStep', order: 'asc', page: 1, perPage: 25 }, staff);
		expect(page).toMatchObject({ total: 12_345_678, totalExact: false, pages: TABLE_ROW_LIMIT / 25 });
		const low = makePlantTableService({
			repository: { ...plantTableRepository, page: async () => [], countUpTo: async (_w, cap) => cap, estimate: async () => 3 },
			today: async () => '2026-06-01'
		});
		expect((await low.list({ sort: 'nextStep', order: 'asc', page: 1, perPage: 25 }, staff)).total).toBe(TABLE_ROW_LIMIT + 1);
	});
});
