import { describe, expect, it } from 'vitest';
import { matchBatches, type StallBatch } from '../../../src/lib/stall/search';
import { flushQueue, postSale, readQueue, writeQueue, type QueuedSale, type SendOutcome } from '../../../src/lib/stall/queue';

const batch = (id: number, name: string, onHand = 3, loaded = false): StallBatch => ({
	id,
	cultivar: { slug: name.toLowerCase().replace(/\s+/g, '-'), name },
	pottedOn: '2026-01-01',
	ageWeeks: 10,
	onHand,
	location: loaded ? { marketDayId: 1, on: '2026-03-07', place: 'Quay' } : null,
	usualPriceCents: 1800
});

describe('stall type-ahead', () => {
	const list = [batch(1, 'Grand Nain'), batch(2, 'Dwarf Namwah'), batch(3, 'Goldfinger', 0), batch(4, 'Ice Cream', 2, true), batch(5, 'Namwah')];
	it('puts names starting with the letters before names that only contain them', () => {
		expect(matchBatches(list, 'nam').map((b) => b.id)).toEqual([5, 2]);
		expect(matchBatches(list, 'na').map((b) => b.id)).toEqual([5, 1, 2]);
	});
	it('shows batches loaded for today first, and nothing sold out', () => {
		expect(matchBatches(list, '').map((b) => b.id)).toEqual([4, 1, 2, 5]);
		expect(matchBatches(list, 'gold')).toEqual([]);
	});
	it('ignores case and accents', () => {
		expect(matchBatches([batch(9, 'Pisang Ceylán')], 'CEYLAN').map((b) => b.id)).toEqual([9]);
	});
});

function memoryStore() {
	const data = new Map<string, string>();
	return { getItem: (k: string) => data.get(k) ?? null, setItem: (k: string, v: string) => void data.set(k, v) };
}
const sale = (clientId: string): QueuedSale => ({ clientId, batchId: 1, quantity: 1, pricePerPlant: 12, label: 'x', queuedAt: '2026-03-07T08:00:00Z' });

describe('offline queue', () => {
	it('keeps everything while offline and sends in order when back', async () => {
		const store = memoryStore();
		writeQueue(store, [sale('a'), sale('b')]);
		expect(await flushQueue(store, async () => ({ kind: 'offline' }), () => {})).toBe(0);
		expect(readQueue(store).map((s) => s.clientId)).toEqual(['a', 'b']);
		const seen: string[] = [];
		expect(await flushQueue(store, async (s) => (seen.push(s.clientId), { kind: 'stored', body: null }), () => {})).toBe(2);
		expect(seen).toEqual(['a', 'b']);
		expect(readQueue(store)).toEqual([]);
	});
	it('drops a refused sale (it will not change by resending) and reports it', async () => {
		const store = memoryStore();
		writeQueue(store, [sale('a')]);
		const reports: SendOutcome[] = [];
		await flushQueue(store, async () => ({ kind: 'refused', message: 'Sold out' }), (_s, o) => reports.push(o));
		expect(reports).toEqual([{ kind: 'refused', message: 'Sold out' }]);
		expect(readQueue(store)).toEqual([]);
	});
	it('reads a damaged store as empty', () => {
		const store = memoryStore();
		store.setItem('bunchline.stall.queue', '{not json');
		expect(readQueue(store)).toEqual([]);
	});
	it('treats a network failure and a 5xx as offline, a 409 as a refusal naming its reason', async () => {
		expect(await postSale(sale('a'), async () => Promise.reject(new TypeError('Failed to fetch')))).toEqual({ kind: 'offline' });
		expect(await postSale(sale('a'), async () => new Response('', { status: 502 }))).toEqual({ kind: 'offline' });
		const refused = await postSale(sale('a'), async () => Response.json({ error: { message: 'x', issues: [{ path: ['quantity'], message: 'Only 1 left in this batch' }] } }, { status: 409 }));
		expect(refused).toEqual({ kind: 'refused', message: 'Only 1 left in this batch' });
	});
	it('sends the sale without the screen-only fields', async () => {
		let body = '';
		await postSale(sale('a'), async (_url, init) => ((body = String(init?.body)), Response.json({}, { status: 201 })));
		expect(JSON.parse(body)).toEqual({ clientId: 'a', batchId: 1, quantity: 1, pricePerPlant: 12 });
	});
});
