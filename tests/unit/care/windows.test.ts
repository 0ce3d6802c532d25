/**
 * The plan's windows: wider in gardens cooler than the reference climate, and a harvest window
 * that opens at the commercial grade (the bunch may be cut green) with its likely day at the home
 * harvest on the plant. The figures come from the calibration anchors (docs/calibration.md).
 */
import { describe, expect, it } from 'vitest';
import { computePlan } from '../../../src/lib/care/plan';
import { climateCoolness } from '../../../src/lib/care/model';
import { annualThermalTime, leafEmissionRate } from '../../../src/lib/care/thermal';
import { station } from '../../../src/lib/care/calibration/stations';
import { days, input, only } from './helpers';

const constant = (c: number) => ({ monthlyMeanC: Array(12).fill(c) });
const coolnessOf = (monthlyMeanC: readonly number[]) => climateCoolness(annualThermalTime(monthlyMeanC, leafEmissionRate));
const widthDays = (step: { earliest: string; latest: string }) => days(step.earliest, step.latest);

describe('windows widen in gardens cooler than the reference climate', () => {
	it('the reference climate and anything warmer are not widened; Tenerife and Alstonville are, Alstonville more', () => {
		expect(coolnessOf(input().climate.monthlyMeanC)).toBe(0);
		expect(coolnessOf(station('abidjan').monthlyMeanC)).toBe(0);
		const tenerife = coolnessOf(station('santa-cruz-de-tenerife').monthlyMeanC);
		const alstonville = coolnessOf(station('alstonville').monthlyMeanC);
		expect(tenerife).toBeGreaterThan(0.1);
		expect(alstonville).toBeGreaterThan(tenerife);
	});

	it('a cooler garden gets a wider shooting window relative to its own wait, not only more days', () => {
		const share = (monthlyMeanC: number[]) => {
			const shot = only(computePlan(input({ climate: { monthlyMeanC } })), 'shooting');
			return widthDays(shot) / days('2025-03-15', shot.likely);
		};
		// Constant climates: days are proportional to degree-days, so the share is the window rule itself.
		expect(share(constant(18).monthlyMeanC)).toBeGreaterThan(1.5 * share(constant(27).monthlyMeanC));
	});

	it('Tenerife: the harvest windows over plantings in every month span the Canarian growers’ 15–24 months (weak source, used as a range)', () => {
		const tenerife = { monthlyMeanC: [...station('santa-cruz-de-tenerife').monthlyMeanC] };
		const spans = Array.from({ length: 12 }, (_, i) => {
			const plantedOn = `2025-${String(i + 1).padStart(2, '0')}-15`;
			const h = only(computePlan(input({ climate: tenerife, plantedOn })), 'harvest');
			return [days(plantedOn, h.earliest), days(plantedOn, h.latest)].map((d) => d / (365.2425 / 12));
		});
		expect(Math.min(...spans.map((s) => s[0]))).toBeLessThanOrEqual(15);
		expect(Math.max(...spans.map((s) => s[1]))).toBeGreaterThanOrEqual(24);
	});
});

describe('the harvest window opens when the bunch may be cut green', () => {
	// Umber et al. 2011 (Sci. Hortic. 129:52): Grand Nain reaches the commercial grade 970 °C·d above
	// 13.9 °C after flowering, 74 days at a constant 27 °C.
	const at27 = computePlan(input({ climate: constant(27), plantedOn: '2025-01-15', observed: { shotOn: '2026-03-01' } }));
	const harvest = only(at27, 'harvest');

	it('at a constant 27 °C the window opens within the plan’s share of the published 74 days', () => {
		const opens = days('2026-03-01', harvest.earliest);
		expect(opens).toBeLessThanOrEqual(970 / (27 - 13.9));
		expect(opens).toBeGreaterThanOrEqual(0.85 * (970 / (27 - 13.9)));
	});

	it('the likely day is the home harvest, later than the green cut by the home-ripeness factor', () => {
		const likely = days('2026-03-01', harvest.likely);
		expect(likely / (970 / (27 - 13.9))).toBeGreaterThan(1.3);
		expect(likely / (970 / (27 - 13.9))).toBeLessThan(1.6);
		expect(harvest.latest > harvest.likely).toBe(true);
	});

	it('the ripening step shares the harvest window; a logged harvest pins both to its day', () => {
		expect(only(at27, 'ripening').earliest).toBe(harvest.earliest);
		const logged = computePlan(input({ climate: constant(27), plantedOn: '2025-01-15', observed: { shotOn: '2026-03-01', harvestedOn: '2026-06-20' } }));
		const h = only(logged, 'harvest');
		expect([h.earliest, h.likely, h.latest]).toEqual(['2026-06-20', '2026-06-20', '2026-06-20']);
	});
});
