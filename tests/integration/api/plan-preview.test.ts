import { describe, expect, it } from 'vitest';
import { GET as getCultivars } from '../../../src/routes/api/v1/cultivars/+server';
import { GET as getClimates } from '../../../src/routes/api/v1/climates/+server';
import { POST as postPreview } from '../../../src/routes/api/v1/plan-preview/+server';
import { GET as getIcs } from '../../../src/routes/api/v1/plan-preview.ics/+server';
import { call, climates, cultivars, issuePaths, postJson, validBody } from './helpers';

const ISO = /^\d{4}-\d{2}-\d{2}$/;
const REQUIRED_KINDS = ['planting', 'feeding', 'followers', 'thinning', 'division', 'shooting', 'harvest', 'cut-back', 'stem-removal'];

interface StepBody {
	kind: string;
	title: string;
	earliest: string;
	likely: string;
	latest: string;
	generation: number;
	amount?: { value: number; unit: string; measure?: string };
	cautions?: string[];
}

describe('GET /api/v1/cultivars', () => {
	it('lists every cultivar with slug, name, group and sourced parameters', async () => {
		const res = await call(getCultivars, '/api/v1/cultivars');
		expect(res.status).toBe(200);
		const body = (await res.json()) as { cultivars: Record<string, unknown>[] };
		// The built-in cultivars, and any of the nursery's own.
		for (const c of cultivars) expect(body.cultivars.map((b) => b.slug)).toContain(c.slug);
		for (const c of body.cultivars) {
			expect(c).toMatchObject({ slug: expect.any(String), name: expect.any(String), group: expect.any(String) });
			expect(c.leavesToShooting).toMatchObject({ value: expect.any(Number), source: { kind: expect.any(String) } });
		}
	});
});

describe('GET /api/v1/climates', () => {
	it('lists every climate with 12 monthly means and a source', async () => {
		const res = await call(getClimates, '/api/v1/climates');
		expect(res.status).toBe(200);
		const body = (await res.json()) as { climates: { slug: string; name: string; monthlyMeanC: number[]; source: unknown }[] };
		for (const c of climates) expect(body.climates.map((b) => b.slug)).toContain(c.slug);
		for (const c of body.climates) {
			expect(typeof c.slug).toBe('string');
			expect(typeof c.name).toBe('string');
			expect(c.monthlyMeanC).toHaveLength(12);
			expect(c.monthlyMeanC.every((t) => typeof t === 'number')).toBe(true);
			expect(c.source).toMatchObject({ kind: expect.any(String) });
		}
	});
});

describe('POST /api/v1/plan-preview: every cultivar in every climate', () => {
	for (const cultivar of cultivars) {
		for (const climate of climates) {
			it(`${cultivar.slug} in ${climate.slug}`, async () => {
				const res = await postJson(postPreview, '/api/v1/plan-preview', { ...validBody, cultivar: cultivar.slug, climate: climate.slug });
				expect(res.status).toBe(200);
				const { steps } = (await res.json()) as { steps: StepBody[] };
				expect(steps.length).toBeGreaterThan(0);
				for (const s of steps) {
					for (const d of [s.earliest, s.likely, s.latest]) expect(d).toMatch(ISO);
					expect(s.earliest <= s.likely && s.likely <= s.latest).toBe(true);
					expect(typeof s.title).toBe('string');
					expect(Number.isInteger(s.generation)).toBe(true);
					if (s.amount) expect(['g', 'kg', 'oz', 'lb']).toContain(s.amount.unit);
				}
				const likely = steps.map((s) => s.likely);
				expect(likely).toEqual([...likely].sort());
				const kinds = new Set(steps.map((s) => s.kind));
				for (const kind of REQUIRED_KINDS) expect(kinds, kind).toContain(kind);
			});
		}
	}
});

describe('POST /api/v1/plan-preview: other valid forms', () => {
	it('accepts 12 monthly means, imperial units and observed milestones', async () => {
		const res = await postJson(postPreview, '/api/v1/plan-preview', {
			...validBody,
			climate: { monthlyMeanC: climates[0].monthlyMeanC },
			units: 'imperial',
			observed: { shotOn: '2027-01-10', harvestedOn: '2027-04-20' }
		});
		expect(res.status).toBe(200);
		const { steps } = (await res.json()) as { steps: StepBody[] };
		const units = new Set(steps.flatMap((s) => (s.amount ? [s.amount.unit] : [])));
		for (const u of units) expect(['oz', 'lb']).toContain(u);
	});
});

describe('POST /api/v1/plan-preview: refusals are 400 naming the field, never 500', () => {
	const cases: [string, unknown, string][] = [
		['impossible date', { ...validBody, plantedOn: '2026-02-30' }, 'plantedOn'],
		['date in the wrong format', { ...validBody, plantedOn: '15/03/2026' }, 'plantedOn'],
		['unknown cultivar', { ...validBody, cultivar: 'no-such-banana' }, 'cultivar'],
		['unknown climate', { ...validBody, climate: 'atlantis' }, 'climate'],
		['eleven monthly values', { ...validBody, climate: { monthlyMeanC: climates[0].monthlyMeanC.slice(0, 11) } }, 'climate.monthlyMeanC'],
		['a temperature out of range', { ...validBody, climate: { monthlyMeanC: [...climates[0].monthlyMeanC.slice(0, 11), 80] } }, 'climate.monthlyMeanC.11'],
		['a climate too cool to fruit', { ...validBody, climate: { monthlyMeanC: Array(12).fill(5) } }, 'climate.monthlyMeanC'],
		['negative age', { ...validBody, ageAtPlantingWeeks: -1 }, 'ageAtPlantingWeeks'],
		['fractional age', { ...validBody, ageAtPlantingWeeks: 2.5 }, 'ageAtPlantingWeeks'],
		['age over 104 weeks', { ...validBody, ageAtPlantingWeeks: 105 }, 'ageAtPlantingWeeks'],
		['age as a string', { ...validBody, ageAtPlantingWeeks: '12' }, 'ageAtPlantingWeeks'],
		['unknown units', { ...validBody, units: 'furlongs' }, 'units'],
		['shooting before planting', { ...validBody, observed: { shotOn: '2026-01-01' } }, 'observed.shotOn'],
		['harvest before shooting', { ...validBody, observed: { shotOn: '2027-01-10', harvestedOn: '2026-12-01' } }, 'observed.harvestedOn'],
		['missing cultivar', { ...validBody, cultivar: undefined }, 'cultivar'],
		['a JSON array instead of an object', [validBody], '']
	];
	for (const [name, body, path] of cases) {
		it(name, async () => {
			const paths = await issuePaths(await postJson(postPreview, '/api/v1/plan-preview', body));
			expect(paths).toContain(path);
		});
	}

	it('body that is not JSON', async () => {
		const res = await call(postPreview, '/api/v1/plan-preview', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"cultivar": ' });
		expect(await issuePaths(res)).toEqual(['']);
	});

	it('wrong content type', async () => {
		const res = await call(postPreview, '/api/v1/plan-preview', { method: 'POST', headers: { 'content-type': 'text/plain' }, body: JSON.stringify(validBody) });
		expect(await issuePaths(res)).toEqual(['']);
	});

	it('names every failing field at once', async () => {
		const paths = await issuePaths(await postJson(postPreview, '/api/v1/plan-preview', { ...validBody, plantedOn: '2026-13-01', ageAtPlantingWeeks: -3 }));
		expect(paths).toEqual(expect.arrayContaining(['plantedOn', 'ageAtPlantingWeeks']));
	});
});

describe('GET /api/v1/plan-preview.ics', () => {
	const base = `cultivar=${validBody.cultivar}&plantedOn=${validBody.plantedOn}&ageAtPlantingWeeks=12`;

	it('serves a calendar attachment for a catalogue climate', async () => {
		const res = await call(getIcs, `/api/v1/plan-preview.ics?${base}&climate=${validBody.climate}`);
		expect(res.status).toBe(200);
		expect(res.headers.get('content-type')).toBe('text/calendar; charset=utf-8');
		expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="[\w.-]+\.ics"$/);
		expect(await res.text()).toMatch(/^BEGIN:VCALENDAR/);
	});

	it('accepts 12 comma-separated monthly means, units and observed dates', async () => {
		const means = climates[0].monthlyMeanC.join(',');
		const res = await call(getIcs, `/api/v1/plan-preview.ics?${base}&monthlyMeanC=${means}&units=imperial&shotOn=2027-01-10&harvestedOn=2027-04-20`);
		expect(res.status).toBe(200);
	});

	const cases: [string, string, string][] = [
		['impossible date', `cultivar=${validBody.cultivar}&plantedOn=2026-02-30&ageAtPlantingWeeks=12&climate=${validBody.climate}`, 'plantedOn'],
		['unknown cultivar', `cultivar=nope&plantedOn=2026-03-15&ageAtPlantingWeeks=12&climate=${validBody.climate}`, 'cultivar'],
		['unknown climate', `${base}&climate=atlantis`, 'climate'],
		['no climate at all', base, 'climate'],
		['eleven monthly values', `${base}&monthlyMeanC=${climates[0].monthlyMeanC.slice(0, 11).join(',')}`, 'monthlyMeanC'],
		['a monthly value that is not a number', `${base}&monthlyMeanC=${[...climates[0].monthlyMeanC.slice(0, 11), 'warm'].join(',')}`, 'monthlyMeanC.11'],
		['negative age', `cultivar=${validBody.cultivar}&plantedOn=2026-03-15&ageAtPlantingWeeks=-1&climate=${validBody.climate}`, 'ageAtPlantingWeeks'],
		['fractional age', `cultivar=${validBody.cultivar}&plantedOn=2026-03-15&ageAtPlantingWeeks=1.5&climate=${validBody.climate}`, 'ageAtPlantingWeeks'],
		['blank age', `cultivar=${validBody.cultivar}&plantedOn=2026-03-15&ageAtPlantingWeeks=&climate=${validBody.climate}`, 'ageAtPlantingWeeks'],
		['harvest before shooting', `${base}&climate=${validBody.climate}&shotOn=2027-01-10&harvestedOn=2026-12-01`, 'harvestedOn']
	];
	for (const [name, query, path] of cases) {
		it(`400 for ${name}`, async () => {
			expect(await issuePaths(await call(getIcs, `/api/v1/plan-preview.ics?${query}`))).toContain(path);
		});
	}
});
