// Bad input on every sale-side form: a 4xx, the reason shown beside the field, and nothing written.
import { sql } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { db } from '../../src/lib/server/db';
import { baseUrl } from '../helpers/browser';

const long = (n: number) => 'a'.repeat(n);
const cookies: Record<string, string> = {};
let batchId = '';
let claimPath = '';

async function submit(action: string, fields: Record<string, string | string[]>, cookie = '') {
	const body = new URLSearchParams();
	for (const [k, v] of Object.entries(fields)) for (const value of [v].flat()) body.append(k, value);
	return fetch(`${baseUrl()}${action}`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: baseUrl(), ...(cookie ? { cookie } : {}) },
		body
	});
}

async function counts(): Promise<Record<string, number>> {
	const rows = await db.execute<{ t: string; n: number }>(sql`
		select 'batches' as t, count(*)::int as n from stock_batches union all
		select 'movements', count(*)::int from stock_movements union all
		select 'on_hand', coalesce(sum(on_hand), 0)::int from stock_batches union all
		select 'sales', count(*)::int from sales where undone_at is null union all
		select 'plants', count(*)::int from plants union all
		select 'claimed', count(claimed_at)::int from plants union all
		select 'market_days', count(*)::int from market_days union all
		select 'waitlist', count(*)::int from waitlist_entries`);
	return Object.fromEntries([...rows].map((r) => [r.t, r.n]));
}

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	for (const [role, i] of [['owner', 0], ['staff', 1], ['gardener', 3]] as const) {
		const res = await submit('/login?/signin', { email: DEMO_ACCOUNTS[i].email, password: DEMO_PASSWORD });
		cookies[role] = res.headers.getSetCookie().find((c) => c.startsWith('bunchline_session='))!.split(';')[0];
	}
	const stock = (await (await fetch(`${baseUrl()}/api/v1/stock`, { headers: { cookie: cookies.staff } })).json()) as { batches: { id: number; onHand: number }[] };
	batchId = String(stock.batches.find((b) => b.onHand >= 2)!.id);
	// Sell one plant to have a fresh claim code, then claim it so it is used.
	const sold = await fetch(`${baseUrl()}/api/v1/sales`, {
		method: 'POST',
		headers: { 'content-type': 'application/json', cookie: cookies.staff },
		body: JSON.stringify({ batchId: Number(batchId), quantity: 1, pricePerPlant: 10, clientId: crypto.randomUUID() })
	});
	claimPath = new URL(((await sold.json()) as { plants: { claimLink: string }[] }).plants[0].claimLink).pathname;
});

const sale = (extra: Record<string, string>) => ({ batchId, quantity: '1', pricePerPlant: '12.50', buyerEmail: '', clientId: crypto.randomUUID(), ...extra });
const claim = (extra: Record<string, string | string[]>) => ({ plantedOn: new Date().toISOString().slice(0, 10), climate: 'south-florida-coast', units: 'metric', ...extra });

type Case = { form: string; action: () => string; fields: () => Record<string, string | string[]>; message: RegExp; status: number; as: 'owner' | 'staff' | 'gardener' | null };
const cases: Case[] = [
	{ form: 'stall', action: () => '/nursery/stall?/sell', fields: () => sale({ quantity: '' }), message: /whole number of plants/, status: 400, as: 'staff' },
	{ form: 'stall', action: () => '/nursery/stall?/sell', fields: () => sale({ quantity: '-2' }), message: /whole number of plants/, status: 400, as: 'staff' },
	{ form: 'stall', action: () => '/nursery/stall?/sell', fields: () => sale({ quantity: '1.5' }), message: /whole number of plants/, status: 400, as: 'staff' },
	{ form: 'stall', action: () => '/nursery/stall?/sell', fields: () => sale({ pricePerPlant: 'cheap' }), message: /Enter a price/, status: 400, as: 'staff' },
	{ form: 'stall', action: () => '/nursery/stall?/sell', fields: () => sale({ buyerEmail: `${long(250)}@x.test` }), message: /254 characters/, status: 400, as: 'staff' },
	{ form: 'stall', action: () => '/nursery/stall?/sell', fields: () => sale({ quantity: '50' }), message: /Only \d+ left|Sold out/, status: 409, as: 'staff' },
	{ form: 'undo', action: () => '/nursery/stall?/undo', fields: () => ({ saleId: 'x' }), message: /Choose a sale/, status: 400, as: 'staff' },
	{ form: 'receive', action: () => '/nursery/stock?/receive', fields: () => ({ _form: 'receive', cultivar: '', count: '5', pottedOn: '2026-01-01', location: 'nursery' }), message: /Choose a cultivar/, status: 400, as: 'owner' },
	{ form: 'receive', action: () => '/nursery/stock?/receive', fields: () => ({ _form: 'receive', cultivar: 'grand-nain', count: '-5', pottedOn: '2026-01-01', location: 'nursery' }), message: /whole number of plants/, status: 400, as: 'owner' },
	{ form: 'receive', action: () => '/nursery/stock?/receive', fields: () => ({ _form: 'receive', cultivar: 'grand-nain', count: '5', pottedOn: '2999-01-01', location: 'nursery' }), message: /after today|year between/, status: 400, as: 'owner' },
	{ form: 'adjust', action: () => '/nursery/stock?/adjust', fields: () => ({ _form: 'adjust', batchId, change: '2.5', reason: 'x' }), message: /whole number/, status: 400, as: 'staff' },
	{ form: 'adjust', action: () => '/nursery/stock?/adjust', fields: () => ({ _form: 'adjust', batchId, change: '-1', reason: long(201) }), message: /at most 200 characters/, status: 400, as: 'staff' },
	{ form: 'adjust', action: () => '/nursery/stock?/adjust', fields: () => ({ _form: 'adjust', batchId, change: '-100000', reason: 'x' }), message: /larger than any batch/, status: 400, as: 'staff' },
	{ form: 'move', action: () => '/nursery/stock?/move', fields: () => ({ _form: 'move', batchId, count: '9999', to: 'nursery' }), message: /already there|Only \d+ on hand/, status: 400, as: 'staff' },
	{ form: 'market day', action: () => '/nursery/stock?/marketDay', fields: () => ({ _form: 'marketDay', on: '2026-13-01', place: 'Quay' }), message: /Enter a date|No such date/, status: 400, as: 'staff' },
	{ form: 'market day', action: () => '/nursery/stock?/marketDay', fields: () => ({ _form: 'marketDay', on: '2026-12-01', place: long(121) }), message: /at most 120 characters/, status: 400, as: 'staff' },
	{ form: 'resend', action: () => '/nursery/sales/1/card?/resend', fields: () => ({ email: 'not-an-address' }), message: /e-mail address like/, status: 400, as: 'staff' },
	{ form: 'reissue', action: () => '/nursery/sales/1/card?/reissue', fields: () => ({}), message: /Tick the box/, status: 400, as: 'staff' },
	{ form: 'claim', action: () => claimPath, fields: () => claim({ plantedOn: '2001-01-01' }), message: /before the sale/, status: 400, as: 'gardener' },
	{ form: 'claim', action: () => claimPath, fields: () => claim({ plantedOn: '' }), message: /YYYY-MM-DD/, status: 400, as: 'gardener' },
	{ form: 'claim', action: () => claimPath, fields: () => claim({ climate: 'custom', monthlyMeanC: Array(12).fill('') }), message: /Enter a temperature from/, status: 400, as: 'gardener' },
	{ form: 'claim', action: () => claimPath, fields: () => claim({ units: 'furlongs' }), message: /metric or imperial/, status: 400, as: 'gardener' },
	{ form: 'waitlist', action: () => '/cultivars?/wait', fields: () => ({ cultivar: 'grand-nain', email: '' }), message: /Enter an e-mail/, status: 400, as: null },
	{ form: 'waitlist', action: () => '/cultivars?/wait', fields: () => ({ cultivar: 'grand-nain', email: 'in-stock@example.test' }), message: /is in stock/, status: 409, as: null }
];

describe('every sale-side form refuses bad input without writing', () => {
	for (const c of cases) {
		it(`${c.form}: ${c.message.source} → ${c.status}`, async () => {
			const before = await counts();
			const res = await submit(c.action(), c.fields(), c.as ? cookies[c.as] : '');
			const html = await res.text();
			expect(res.status, html.slice(0, 300)).toBe(c.status);
			expect(html).toMatch(c.message);
			expect(await counts()).toEqual(before);
		});
	}

	it('a used claim code is 410, and claiming it again writes nothing', async () => {
		const ok = await submit(claimPath, claim({}), cookies.gardener);
		expect(ok.status).toBe(303);
		const before = await counts();
		const again = await submit(claimPath, claim({}), cookies.gardener);
		expect(again.status).toBe(410);
		expect(await fetch(`${baseUrl()}${claimPath}`).then((r) => r.status)).toBe(410);
		expect(await fetch(`${baseUrl()}/claim/abcdefghijklmnopqrstuvwxyz234567`).then((r) => r.status)).toBe(404);
		expect(await counts()).toEqual(before);
	});
});
