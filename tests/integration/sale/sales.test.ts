import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../../src/lib/server/db';
import { plants, sales, stockBatches } from '../../../src/lib/server/db/schema';
import { salesService, stockService } from '../../../src/lib/server/sale-side';
import { POST as postSale } from '../../../src/routes/api/v1/sales/+server';
import { DELETE as deleteSale } from '../../../src/routes/api/v1/sales/[id]/+server';
import { GET as getStock, POST as postStock } from '../../../src/routes/api/v1/stock/+server';
import { waitForMail } from '../../helpers/mail';
import { batchOf, callAs, daysAgo, newClientId, person, refusal, refusedFields, saleCounts, today, type Person } from './helpers';

let owner: Person;
let staff: Person;
let gardener: Person;

beforeAll(async () => {
	[owner, staff, gardener] = await Promise.all([person('owner'), person('staff'), person('gardener')]);
});

const saleBody = (batchId: number, extra: Record<string, unknown> = {}) => ({ batchId, quantity: 1, pricePerPlant: 18.5, clientId: newClientId(), ...extra });

describe('POST /api/v1/stock', () => {
	it('receives a batch and answers it with its id; GET lists it', async () => {
		const res = await callAs(postStock, owner, '/api/v1/stock', { body: { cultivar: 'dwarf-cavendish', count: 12, pottedOn: daysAgo(70) } });
		expect(res.status).toBe(201);
		const { batch } = (await res.json()) as { batch: { id: number; onHand: number; ageWeeks: number; cultivar: { slug: string } } };
		expect(batch).toMatchObject({ onHand: 12, ageWeeks: 10, cultivar: { slug: 'dwarf-cavendish' } });
		const list = await callAs(getStock, staff, '/api/v1/stock?size=100');
		const body = (await list.json()) as { batches: { id: number }[]; total: number };
		expect(body.batches.map((b) => b.id)).toContain(batch.id);
		expect(body.total).toBeGreaterThanOrEqual(1);
	});

	it('is for the owner: staff get 403, gardeners 403, signed out 401, in the API shape', async () => {
		const body = { cultivar: 'dwarf-cavendish', count: 1, pottedOn: daysAgo(70) };
		expect((await callAs(postStock, staff, '/api/v1/stock', { body })).status).toBe(403);
		expect((await callAs(postStock, gardener, '/api/v1/stock', { body })).status).toBe(403);
		const res = await callAs(postStock, null, '/api/v1/stock', { body });
		expect(res.status).toBe(401);
		expect(((await res.json()) as { error: { message: string } }).error.message).toBeTruthy();
		expect((await callAs(getStock, gardener, '/api/v1/stock')).status).toBe(403);
	});

	const bad: [string, Record<string, unknown>, string][] = [
		['an empty cultivar', { cultivar: '', count: 3, pottedOn: daysAgo(7) }, 'cultivar'],
		['an unknown cultivar', { cultivar: 'no-such-banana', count: 3, pottedOn: daysAgo(7) }, 'cultivar'],
		['a cultivar name too long', { cultivar: 'x'.repeat(200), count: 3, pottedOn: daysAgo(7) }, 'cultivar'],
		['a negative count', { cultivar: 'grand-nain', count: -3, pottedOn: daysAgo(7) }, 'count'],
		['a fractional count', { cultivar: 'grand-nain', count: 2.5, pottedOn: daysAgo(7) }, 'count'],
		['a count of text', { cultivar: 'grand-nain', count: 'ten', pottedOn: daysAgo(7) }, 'count'],
		['a potting date in the future', { cultivar: 'grand-nain', count: 3, pottedOn: '2999-01-01' }, 'pottedOn'],
		['a potting date that is no date', { cultivar: 'grand-nain', count: 3, pottedOn: '2026-02-30' }, 'pottedOn'],
		['an unknown market day', { cultivar: 'grand-nain', count: 3, pottedOn: daysAgo(7), location: 999999 }, 'location']
	];
	for (const [what, body, field] of bad) {
		it(`refuses ${what} naming ${field}, writing nothing`, async () => {
			const before = await saleCounts();
			expect(await refusedFields(await callAs(postStock, owner, '/api/v1/stock', { body }))).toContain(field);
			expect(await saleCounts()).toEqual(before);
		});
	}
});

describe('POST /api/v1/sales', () => {
	it('records a sale: one plant row per plant, each with its own claim link, and the stock goes down', async () => {
		const batch = await batchOf(5, owner);
		const res = await callAs(postSale, staff, '/api/v1/sales', { body: saleBody(batch.id, { quantity: 3 }) });
		expect(res.status).toBe(201);
		const body = (await res.json()) as { sale: { id: number; quantity: number; pricePerPlant: number }; plants: { id: number; claimLink: string }[] };
		expect(body.sale).toMatchObject({ quantity: 3, pricePerPlant: 18.5 });
		expect(body.plants).toHaveLength(3);
		const links = new Set(body.plants.map((p) => p.claimLink));
		expect(links.size).toBe(3);
		for (const link of links) expect(link).toMatch(/\/claim\/[a-z2-7]{32}$/);
		const [row] = await db.select().from(stockBatches).where(eq(stockBatches.id, batch.id));
		expect(row.onHand).toBe(2);
		// Only hashes are stored: no stored value equals a code.
		const stored = await db.select().from(plants).where(eq(plants.saleId, body.sale.id));
		for (const p of stored) {
			expect(p.claimCodeHash).toMatch(/^[0-9a-f]{64}$/);
			for (const link of links) expect(link).not.toContain(p.claimCodeHash!);
		}
	});

	it('stores a resent sale once (same client id): 200 with the same sale and links', async () => {
		const batch = await batchOf(4, owner);
		const body = saleBody(batch.id, { quantity: 2 });
		const first = await callAs(postSale, staff, '/api/v1/sales', { body });
		const again = await callAs(postSale, staff, '/api/v1/sales', { body });
		expect(first.status).toBe(201);
		expect(again.status).toBe(200);
		const [a, b] = (await Promise.all([first.json(), again.json()])) as { sale: { id: number }; plants: { claimLink: string }[] }[];
		expect(b.sale.id).toBe(a.sale.id);
		expect(b.plants).toEqual(a.plants);
		expect((await db.select().from(sales).where(eq(sales.clientId, body.clientId))).length).toBe(1);
		expect((await db.select().from(stockBatches).where(eq(stockBatches.id, batch.id)))[0].onHand).toBe(2);
	});

	it('22 sellers of the last plant at once: exactly one sale, the rest 409, and the count is 0', async () => {
		const batch = await batchOf(1, owner);
		const responses = await Promise.all(Array.from({ length: 22 }, () => callAs(postSale, staff, '/api/v1/sales', { body: saleBody(batch.id) })));
		const statuses = responses.map((r) => r.status).sort();
		expect(statuses.filter((s) => s === 201)).toHaveLength(1);
		expect(statuses.filter((s) => s === 409)).toHaveLength(21);
		const refused = responses.find((r) => r.status === 409)!;
		expect(((await refused.json()) as { error: { issues: { path: string[] }[] } }).error.issues[0].path).toEqual(['quantity']);
		const [row] = await db.select().from(stockBatches).where(eq(stockBatches.id, batch.id));
		expect(row.onHand).toBe(0);
		expect((await db.select().from(sales).where(eq(sales.batchId, batch.id))).length).toBe(1);
	});

	it('e-mails the claim links to the buyer right away', async () => {
		const batch = await batchOf(2, owner);
		const buyer = `buyer.${Date.now()}@example.test`;
		const res = await callAs(postSale, staff, '/api/v1/sales', { body: saleBody(batch.id, { buyerEmail: buyer, quantity: 2 }) });
		const body = (await res.json()) as { mailed: boolean; plants: { claimLink: string }[] };
		expect(body.mailed).toBe(true);
		const mail = await waitForMail(buyer, 'claim its care plan');
		for (const p of body.plants) expect(mail.body).toContain(p.claimLink);
	});

	it('refuses gardeners (403) and signed-out callers (401)', async () => {
		const batch = await batchOf(1, owner);
		expect((await callAs(postSale, gardener, '/api/v1/sales', { body: saleBody(batch.id) })).status).toBe(403);
		expect((await callAs(postSale, null, '/api/v1/sales', { body: saleBody(batch.id) })).status).toBe(401);
	});

	const badSales: [string, Record<string, unknown>, string][] = [
		['a negative quantity', { quantity: -1 }, 'quantity'],
		['a fractional quantity', { quantity: 1.5 }, 'quantity'],
		['a zero quantity', { quantity: 0 }, 'quantity'],
		['a quantity above the stall limit', { quantity: 51 }, 'quantity'],
		['a price of text', { pricePerPlant: 'twelve' }, 'pricePerPlant'],
		['a negative price', { pricePerPlant: -2 }, 'pricePerPlant'],
		['a price below the cent', { pricePerPlant: 12.345 }, 'pricePerPlant'],
		['a malformed e-mail', { buyerEmail: 'not an address' }, 'buyerEmail'],
		['an e-mail too long', { buyerEmail: `${'a'.repeat(250)}@example.test` }, 'buyerEmail'],
		['no client id', { clientId: undefined }, 'clientId'],
		['a client id that is no UUID', { clientId: 'abc' }, 'clientId'],
		['no batch', { batchId: undefined }, 'batchId']
	];
	for (const [what, extra, field] of badSales) {
		it(`refuses ${what} naming ${field}, writing nothing`, async () => {
			const batch = await batchOf(3, owner);
			const before = await saleCounts();
			expect(await refusedFields(await callAs(postSale, staff, '/api/v1/sales', { body: saleBody(batch.id, extra) }))).toContain(field);
			expect(await saleCounts()).toEqual(before);
		});
	}

	it('refuses an unknown batch with 404 and more plants than on hand with 409, writing nothing', async () => {
		const batch = await batchOf(2, owner);
		const before = await saleCounts();
		expect(await refusedFields(await callAs(postSale, staff, '/api/v1/sales', { body: saleBody(99999999) }), 404)).toEqual(['batchId']);
		expect(await refusedFields(await callAs(postSale, staff, '/api/v1/sales', { body: saleBody(batch.id, { quantity: 3 }) }), 409)).toEqual(['quantity']);
		expect(await saleCounts()).toEqual(before);
	});

	it('refuses a body that is not JSON', async () => {
		const url = new URL('/api/v1/sales', 'http://bunchline.test');
		const request = new Request(url, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: 'batchId=1' });
		const res = await postSale({ request, url, params: {}, locals: { user: staff, session: null } } as never);
		expect(res.status).toBe(400);
	});
});

describe('DELETE /api/v1/sales/[id] (undo)', () => {
	it('returns the stock and removes the plants; a second undo is 410', async () => {
		const batch = await batchOf(3, owner);
		const { sale } = await salesService.record(saleBody(batch.id, { quantity: 2 }) as never, staff.id, today());
		const res = await callAs(deleteSale, staff, `/api/v1/sales/${sale.id}`, { method: 'DELETE', params: { id: String(sale.id) } });
		expect(res.status).toBe(200);
		expect(((await res.json()) as { sale: { undone: boolean } }).sale.undone).toBe(true);
		expect((await db.select().from(stockBatches).where(eq(stockBatches.id, batch.id)))[0].onHand).toBe(3);
		expect(await db.select().from(plants).where(eq(plants.saleId, sale.id))).toHaveLength(0);
		expect((await salesService.day(today())).sales.map((s) => s.id)).not.toContain(sale.id);
		const again = await callAs(deleteSale, staff, `/api/v1/sales/${sale.id}`, { method: 'DELETE', params: { id: String(sale.id) } });
		expect(await refusedFields(again, 410)).toEqual(['saleId']);
	});

	it('refuses after the undo window (409), an unknown sale (404) and a malformed id (400)', async () => {
		const batch = await batchOf(1, owner);
		const { sale } = await salesService.record(saleBody(batch.id) as never, staff.id, today());
		const later = new Date(Date.now() + 11 * 60 * 1000);
		expect((await refusal(salesService.undo(sale.id, staff.id, later))).status).toBe(409);
		expect((await db.select().from(stockBatches).where(eq(stockBatches.id, batch.id)))[0].onHand).toBe(0);
		expect(await refusedFields(await callAs(deleteSale, staff, '/api/v1/sales/99999999', { method: 'DELETE', params: { id: '99999999' } }), 404)).toEqual(['saleId']);
		expect(await refusedFields(await callAs(deleteSale, staff, '/api/v1/sales/abc', { method: 'DELETE', params: { id: 'abc' } }))).toEqual(['saleId']);
		expect((await callAs(deleteSale, gardener, `/api/v1/sales/${sale.id}`, { method: 'DELETE', params: { id: String(sale.id) } })).status).toBe(403);
	});
});

describe('stock on the page', () => {
	it('moves plants to a market day and back, never below zero, and reports the day', async () => {
		// A potting day of its own, so the plants coming back join this batch and no other.
		const batch = await stockService.receive({ cultivar: 'williams', count: 10, pottedOn: daysAgo(123), location: undefined }, owner.id, today());
		const day = await stockService.addMarketDay({ on: today(), place: `Test quay ${Date.now()}` });
		await stockService.move({ batchId: batch.id, count: 6, to: day.id }, staff.id);
		expect((await refusal(stockService.move({ batchId: batch.id, count: 5, to: day.id }, staff.id))).status).toBe(409);
		const { batches } = await stockService.sellableToday(today());
		const loaded = batches.find((b) => b.location?.marketDayId === day.id)!;
		expect(loaded.onHand).toBe(6);
		// Loaded batches come first on the stall.
		expect(batches[0].location).not.toBeNull();
		await salesService.record(saleBody(loaded.id, { quantity: 2 }) as never, staff.id, today());
		await stockService.move({ batchId: loaded.id, count: 4, to: null }, staff.id);
		const report = await stockService.dayReport(day.id, today());
		expect(report.rows[0]).toMatchObject({ loaded: 6, sold: 2, returned: 4, onHand: 0 });
		expect((await db.select().from(stockBatches).where(eq(stockBatches.id, batch.id)))[0].onHand).toBe(8);
	});

	it('adjusts with a reason and refuses going below zero', async () => {
		const batch = await batchOf(2, owner);
		expect((await stockService.adjust({ batchId: batch.id, change: -1, reason: 'broken stem' }, staff.id, today())).onHand).toBe(1);
		const before = await saleCounts();
		expect((await refusal(stockService.adjust({ batchId: batch.id, change: -2, reason: 'miscount' }, staff.id, today()))).field).toBe('change');
		expect(await saleCounts()).toEqual(before);
	});
});
