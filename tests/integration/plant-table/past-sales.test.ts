import { count, inArray } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { IMPORT_MAX_BYTES, PAST_SALE_COLUMNS, PAST_SALES_TEMPLATE } from '../../../src/lib/schema/past-sales';
import { db } from '../../../src/lib/server/db';
import { marketDays, plants, sales } from '../../../src/lib/server/db/schema';
import { POST as importSales } from '../../../src/routes/api/v1/past-sales/+server';
import { testUser } from '../../helpers/plant-rows';

type User = { id: number; role: 'owner' | 'staff' | 'gardener'; name: string };
let staff: User;
let gardener: User;
let n = 0;

function post(body: string, user: User | null, type = 'text/csv') {
	const url = new URL('http://bunchline.test/api/v1/past-sales');
	const request = new Request(url, { method: 'POST', headers: { 'content-type': type }, body });
	return Promise.resolve(importSales({ request, url, locals: { user, session: null } } as never));
}

const rowCounts = async () => {
	const [[s], [p], [m]] = await Promise.all([db.select({ n: count() }).from(sales), db.select({ n: count() }).from(plants), db.select({ n: count() }).from(marketDays)]);
	return { sales: s.n, plants: p.n, marketDays: m.n };
};

/** A file of past sales; each run has its own buyer addresses so its rows can be found again. */
function file(rows: string[]): string {
	return [PAST_SALE_COLUMNS.join(','), ...rows].join('\r\n') + '\r\n';
}
const good = () => {
	const tag = ++n;
	return [
		`Grand Nain,2025-03-08,12,buyer${tag}.a@example.test,18.50,Marrowby Quay Saturday Market`,
		`grand-nain,2025-03-08,10,buyer${tag}.b@example.test,18,Marrowby Quay Saturday Market`,
		`Grand Nain,2025-04-02,26,,24.00,`
	];
};

beforeAll(async () => {
	[staff, gardener] = await Promise.all([testUser('staff'), testUser('gardener')]);
});

describe('POST /api/v1/past-sales', () => {
	it('with one bad row writes nothing and names the row and column; fixed, writes every row', async () => {
		const rows = good();
		const bad = [...rows.slice(0, 1), rows[1].replace(',18,', ',eighteen,'), ...rows.slice(2)];
		const before = await rowCounts();
		const refused = await post(file(bad), staff);
		expect(refused.status).toBe(400);
		const body = await refused.json();
		expect(body.error.message).toMatch(/Nothing was imported: 1 row has errors/);
		expect(body.error.issues.map((i: { path: unknown[] }) => i.path)).toEqual([[3, 'price']]);
		expect(await rowCounts()).toEqual(before);

		const res = await post(file(rows), staff);
		expect(res.status, await res.clone().text()).toBe(201);
		expect(await res.json()).toEqual({ imported: 3 });
		const written = await db
			.select({ id: sales.id, soldBy: sales.soldBy, price: sales.pricePerPlantCents, marketDayId: sales.marketDayId, buyer: sales.buyerEmail })
			.from(sales)
			.where(inArray(sales.buyerEmail, [`buyer${n}.a@example.test`, `buyer${n}.b@example.test`]));
		expect(written.map((s) => s.price).sort()).toEqual([1800, 1850]);
		expect(written.every((s) => s.soldBy === staff.id && s.marketDayId !== null)).toBe(true);
		// Both market rows are the same market day.
		expect(new Set(written.map((s) => s.marketDayId)).size).toBe(1);
		const sold = await db.select().from(plants).where(inArray(plants.saleId, written.map((s) => s.id)));
		expect(sold).toHaveLength(2);
		for (const p of sold) {
			expect(p.gardenerId).toBeNull();
			expect(p.claimCodeHash).toMatch(/\S{20,}/);
		}
		expect(sold.map((p) => p.ageAtSaleWeeks).sort()).toEqual([10, 12]);
		const after = await rowCounts();
		expect(after.sales - before.sales).toBe(3);
		expect(after.plants - before.plants).toBe(3);
	});

	it('lists every problem of every row, by row number and column', async () => {
		const text = file([
			'Grand Nain,2025-02-30,12,,18.50,',
			'No Such Banana,2025-03-08,12,,18.50,',
			'Grand Nain,2025-03-08,300,not-an-address,-1,',
			'Grand Nain,2999-03-08,12,,18.50,'
		]);
		const res = await post(text, staff);
		expect(res.status).toBe(400);
		const { error } = await res.json();
		expect(error.message).toMatch(/4 rows have errors/);
		expect(error.issues.map((i: { path: unknown[] }) => i.path.join(':'))).toEqual([
			'2:sale date',
			'3:cultivar',
			'4:age at sale (weeks)',
			'4:buyer e-mail',
			'4:price',
			'5:sale date'
		]);
	});

	it('the template imports as it is', async () => {
		const before = await rowCounts();
		const res = await post(PAST_SALES_TEMPLATE, staff);
		expect(res.status, await res.clone().text()).toBe(201);
		expect((await rowCounts()).plants - before.plants).toBe(2);
	});

	it('refuses a missing column, another content type, an oversized file and a gardener, writing nothing', async () => {
		const before = await rowCounts();
		const noPrice = await post('cultivar,sale date,age at sale (weeks),buyer e-mail,market\r\nGrand Nain,2025-03-08,12,,\r\n', staff);
		expect(noPrice.status).toBe(400);
		expect((await noPrice.json()).error.issues).toEqual([{ path: [1, 'price'], message: expect.stringContaining('price') }]);
		expect((await post(file(good()), staff, 'application/x-www-form-urlencoded')).status).toBe(400);
		const huge = await post(file(good()) + 'x'.repeat(IMPORT_MAX_BYTES), staff);
		expect(huge.status).toBe(413);
		expect((await huge.json()).error.issues[0].message).toMatch(/at most 500 KB/);
		expect((await post(file(good()), gardener)).status).toBe(403);
		expect((await post(file(good()), null)).status).toBe(401);
		expect(await rowCounts()).toEqual(before);
	});
});

