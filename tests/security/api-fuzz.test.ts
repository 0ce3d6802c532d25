// ASVS 1.2.5 / 2.2.1: whatever arrives at the public API, the answer is 200 with a plan or 400 with the error shape, never a 500.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { climates, cultivars } from '$lib/care';
import { POST } from '../../src/routes/api/v1/plan-preview/+server';
import { GET as GET_ICS } from '../../src/routes/api/v1/plan-preview.ics/+server';
import { call, postJson, validBody } from '../integration/api/helpers';

fc.configureGlobal({ seed: process.env.API_FUZZ_SEED === "random" ? Date.now() : 20261202 });

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

describe('plan preview under arbitrary input', () => {
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
