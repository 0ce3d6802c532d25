import { describe, expect, it } from 'vitest';
import { computePlan } from '../../../src/lib/care/plan';
import { defaultFeeding } from '../../../src/lib/care/feeding';
import { K2O_TO_K, P2O5_TO_P } from '../../../src/lib/care/nutrients';
import type { FeedingSettings, Plan } from '../../../src/lib/care/types';
import { days, input, only } from './helpers';

const feedings = (plan: Plan) => plan.steps.filter((s) => s.kind === 'feeding');

describe('feeding ramp, common practice, no source', () => {
	const plan = computePlan(input());
	const f = feedings(plan);
	it('starts at the second new leaf after planting, before the followers', () => {
		expect(f[0].likely >= only(plan, 'planting').likely).toBe(true);
		expect(days(only(plan, 'planting').likely, f[0].likely)).toBeLessThanOrEqual(31);
		expect(f[0].likely < only(plan, 'followers').likely).toBe(true);
	});
	it('handful → ½ can → 1 can, then 1 can every month', () => {
		expect(f.map((s) => s.amount?.measure).slice(0, 5)).toEqual(['1 handful', '½ can (2-lb)', '1 can (2-lb)', '1 can (2-lb)', '1 can (2-lb)']);
		for (let i = 1; i < f.length; i++) {
			const gap = days(f[i - 1].likely, f[i].likely);
			expect(gap).toBeGreaterThanOrEqual(28);
			expect(gap).toBeLessThanOrEqual(31);
		}
	});
	it('continues monthly through the last planned generation', () => {
		expect(f[f.length - 1].likely <= only(plan, 'stem-removal', 2).likely).toBe(true);
		expect(days(f[f.length - 1].likely, only(plan, 'stem-removal', 2).likely)).toBeLessThan(31);
	});
	it('is per mat: one feeding a month however many generations are on the mat', () => {
		const months = f.map((s) => s.likely.slice(0, 7));
		expect(new Set(months).size).toBe(months.length);
		expect(f.every((s) => s.detail.includes('not for each plant'))).toBe(true);
	});
	it('amounts in g / kg (metric) and oz / lb (imperial); nutrients elemental, never negative', () => {
		expect(f[0].amount).toMatchObject({ value: 100, unit: 'g' });
		expect(f[2].amount).toMatchObject({ value: 907, unit: 'g' });
		const imperial = feedings(computePlan(input({ units: 'imperial' })));
		expect(imperial[1].amount).toMatchObject({ value: 1, unit: 'lb' });
		expect(imperial[2].amount).toMatchObject({ value: 2, unit: 'lb' });
		expect(imperial[2].nutrients?.unit).toBe('oz');
		// 2-lb can of 8-10-16: N 8 %, P = 10 % × 0.4364, K = 16 % × 0.8301 (Virginia Tech SPES-201NP)
		expect(f[2].nutrients).toEqual({ n: 72.6, p: 39.6, k: 120.5, unit: 'g' });
		expect(f[2].nutrients!.p).toBeCloseTo(907.18474 * 0.1 * P2O5_TO_P, 1);
		expect(f[2].nutrients!.k).toBeCloseTo(907.18474 * 0.16 * K2O_TO_K, 1);
	});
	it('default analysis is high potassium: K2O about twice N', () => {
		const [n, , k] = defaultFeeding.npk;
		expect(k).toBeGreaterThan(defaultFeeding.npk[1]);
		expect(k / n).toBeCloseTo(2, 5);
	});
	it('every feeding carries the fertilizer cautions', () => {
		for (const s of f) {
			const text = (s.cautions ?? []).join(' ');
			for (const w of ['gloves', 'off the stem', 'children and pets', 'label']) expect(text).toContain(w);
		}
	});
});

describe('local restrictions (e.g. Florida county ordinances banning N and P fertilizer June 1 – September 30)', () => {
	const settings: FeedingSettings = { ...defaultFeeding, restrictedMonths: [6, 7, 8, 9] };
	const plain = feedings(computePlan(input()));
	const restricted = feedings(computePlan(input({ feeding: settings })));
	it('feedings in June–September are flagged restricted and skippable, with a caution', () => {
		const summer = restricted.filter((s) => ['06', '07', '08', '09'].includes(s.likely.slice(5, 7)));
		expect(summer.length).toBeGreaterThan(0);
		for (const s of summer) {
			expect(s.restricted).toMatchObject({ skippable: true });
			expect(s.cautions?.some((c) => c.includes('restrict'))).toBe(true);
		}
		for (const s of restricted.filter((x) => !summer.includes(x))) expect(s.restricted).toBeUndefined();
	});
	it('never silently drops or changes a feeding', () => {
		expect(restricted.length).toBe(plain.length);
		expect(restricted.map((s) => [s.likely, s.amount])).toEqual(plain.map((s) => [s.likely, s.amount]));
	});
});

describe('nitrogen cap, Orange County FL Code §15-804 (1 lb N per 1,000 ft² ≈ 0.488 kg per 100 m² per application)', () => {
	const capped = (area: number) => feedings(computePlan(input({ feeding: { ...defaultFeeding, nitrogenCapKgPer100m2: 0.488, matFootprintM2: area } })));
	it('warns when a full can over a small footprint exceeds the cap', () => {
		// 72.6 g N over 4 m² = 1.81 kg N / 100 m²
		const f = capped(4);
		expect(f[2].cautions?.some((c) => c.includes('above the local cap'))).toBe(true);
		expect(f[0].cautions?.some((c) => c.includes('above the local cap'))).toBe(false);
	});
	it('stays quiet when the footprint is large enough', () => {
		// 72.6 g N over 20 m² = 0.36 kg N / 100 m²
		expect(capped(20).some((s) => s.cautions?.some((c) => c.includes('above the local cap')))).toBe(false);
	});
});
