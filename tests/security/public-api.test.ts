// The public calendar endpoint cannot be used to load the server: calendars come from a bounded
// cache keyed by the plan's inputs, and every /api/ route has a per-address limit (ASVS 2.4.1).
import { describe, expect, it } from 'vitest';
import { climates, cultivars } from '$lib/care';
import { builtInSnapshot } from '$lib/server/catalogue/snapshot';
import { byteCache } from '../../src/lib/server/byte-cache';
import { tokenBucketLimiter } from '../../src/lib/server/api-limit';
import { calendarCache, previewCalendar } from '../../src/lib/server/plan-preview';
import { get } from './helpers';

const catalogue = builtInSnapshot();
const request = { cultivar: cultivars[0].slug, plantedOn: '2026-03-01', ageAtPlantingWeeks: 12, climate: climates[0].slug };

describe('ASVS 2.4.1 calendars are written once per set of inputs', () => {
	it('the same inputs are served from the cache, byte for byte', () => {
		const { hits, misses } = { ...calendarCache.stats };
		const first = previewCalendar(request, catalogue, 'http://bunchline.test');
		const again = previewCalendar({ ...request }, catalogue, 'http://bunchline.test');
		expect(again.ics).toBe(first.ics);
		expect(calendarCache.stats.misses - misses).toBeLessThanOrEqual(1);
		expect(calendarCache.stats.hits - hits).toBeGreaterThanOrEqual(1);
	});
	it('any input that changes the plan gives another calendar', () => {
		const a = previewCalendar(request, catalogue, 'http://bunchline.test').ics;
		expect(previewCalendar({ ...request, ageAtPlantingWeeks: 20 }, catalogue, 'http://bunchline.test').ics).not.toBe(a);
		expect(previewCalendar({ ...request, units: 'imperial' }, catalogue, 'http://bunchline.test').ics).not.toBe(a);
		expect(previewCalendar(request, builtInSnapshot({ npk: [20, 5, 10] }), 'http://bunchline.test').ics).not.toBe(a);
	});
	it('the cache holds at most its byte cap, dropping the least recently used', () => {
		const cache = byteCache(10_000);
		for (let i = 0; i < 100; i++) cache.through(`k${i}`, () => 'x'.repeat(1000));
		expect(cache.size).toBeLessThanOrEqual(10_000);
		cache.through('k99', () => 'recomputed');
		expect(cache.stats.hits).toBe(1);
	});
});

describe('ASVS 2.4.1 a per-address limit on the public API', () => {
	it('the bucket refills evenly and tells how long to wait', () => {
		const limiter = tokenBucketLimiter(60, 3);
		const t = 1_000_000;
		expect([1, 2, 3, 4].map(() => limiter.take('a', t).allowed)).toEqual([true, true, true, false]);
		expect(limiter.take('b', t).allowed).toBe(true);
		const refused = limiter.take('a', t + 10);
		expect(refused).toEqual({ allowed: false, retryAfterS: 1 });
		expect(limiter.take('a', t + 1000).allowed).toBe(true);
	});

	it('the running site answers 429 in the API error shape with Retry-After, then lets the address back in', async () => {
		const statuses: number[] = [];
		let refused: Response | undefined;
		for (let i = 0; i < 200 && !refused; i++) {
			const res = await get('/api/v1/climates');
			statuses.push(res.status);
			if (res.status === 429) refused = res;
			else await res.arrayBuffer();
		}
		expect(refused, 'no 429 after 200 requests').toBeDefined();
		expect(statuses.filter((s) => s === 200).length).toBeGreaterThanOrEqual(100);
		const body = await refused!.json();
		expect(body.error.issues[0].message).toMatch(/Wait \d+ s/);
		const wait = Number(refused!.headers.get('retry-after'));
		expect(wait).toBeGreaterThan(0);
		await new Promise((r) => setTimeout(r, wait * 1000 + 100));
		expect((await get('/api/v1/climates')).status).toBe(200);
	});
});
