import { describe, expect, it } from 'vitest';
import {
	annualThermalTime,
	bananaDevelopmentRate,
	createThermalClock,
	dailyMeanC,
	degreeDaysMethod1,
	degreeDaysMethod2,
	linearResponse,
	thermalClockFor
} from '../../../src/lib/care/thermal';
import { epochDayFromCivil } from '../../../src/lib/care/dates';
import { findClimate } from '../../../src/lib/care/catalogue';

describe('daily degree-days, McMaster & Wilhelm 1997, Agric. For. Meteorol. 87:291–300 (worked examples, base 14 °C)', () => {
	it('Tmax/Tmin 30/18 gives 10 °C·d by both methods', () => {
		expect(degreeDaysMethod1(30, 18, 14)).toBe(10);
		expect(degreeDaysMethod2(30, 18, 14)).toBe(10);
	});
	it('Tmax/Tmin 20/10 gives 1 °C·d by method 1 and 3 °C·d by method 2', () => {
		expect(degreeDaysMethod1(20, 10, 14)).toBe(1);
		expect(degreeDaysMethod2(20, 10, 14)).toBe(3);
	});
	it('method 1 floors at 0 and method 2 is never negative on a cold day', () => {
		expect(degreeDaysMethod1(12, 4, 14)).toBe(0);
		expect(degreeDaysMethod2(12, 4, 14)).toBe(0);
	});
	it('method 2 clips Tmax to an upper threshold when one is given', () => {
		expect(degreeDaysMethod2(40, 20, 14, 30)).toBe(11);
	});
});

describe('thermal time, Umber et al. 2011, Sci. Hortic. 129:52–57', () => {
	it('970 °C·d above 13.9 °C take 74.0 days at a constant 27 °C (±1 day)', () => {
		const clock = createThermalClock(Array(12).fill(27), linearResponse(13.9));
		const start = epochDayFromCivil(2024, 5, 1);
		const day = clock.dayReaching(clock.cumulativeAt(start) + 970, start);
		expect(Math.abs(day - start - 970 / (27 - 13.9))).toBeLessThanOrEqual(1);
		expect(day - start).toBeGreaterThanOrEqual(73);
		expect(day - start).toBeLessThanOrEqual(75);
	});
});

describe('banana response (base 14 °C after Jullien, Chillet & Malézieux 2001; tail and taper are the engine’s documented choice)', () => {
	it('equals T − 14 between 18 and 31 °C', () => {
		for (const t of [18, 20, 25, 27, 31]) expect(bananaDevelopmentRate(t)).toBeCloseTo(t - 14, 12);
	});
	it('slows to nothing at 10 °C and at 38 °C', () => {
		expect(bananaDevelopmentRate(10)).toBe(0);
		expect(bananaDevelopmentRate(9)).toBe(0);
		expect(bananaDevelopmentRate(38)).toBe(0);
		expect(bananaDevelopmentRate(40)).toBe(0);
		expect(bananaDevelopmentRate(12)).toBeGreaterThan(0);
		expect(bananaDevelopmentRate(36)).toBeLessThan(bananaDevelopmentRate(32));
	});
	it('the lower tail joins T − 14 smoothly at 18 °C (value and slope)', () => {
		const h = 1e-6;
		expect(bananaDevelopmentRate(18 - h)).toBeCloseTo(4, 5);
		expect((bananaDevelopmentRate(18) - bananaDevelopmentRate(18 - h)) / h).toBeCloseTo(1, 4);
	});
	it('never decreases up to the optimum', () => {
		let previous = -1;
		for (let t = 0; t <= 33; t += 0.05) {
			const r = bananaDevelopmentRate(t);
			expect(r).toBeGreaterThanOrEqual(previous);
			previous = r;
		}
	});
});

describe('daily temperatures from monthly means', () => {
	const miami = findClimate('south-florida-coast')!.monthlyMeanC;
	it('a constant climate stays constant every day', () => {
		for (let d = 1; d <= 31; d++) expect(dailyMeanC(Array(12).fill(21.5), 1, d, 31)).toBeCloseTo(21.5, 12);
	});
	it('passes through each monthly mean at mid-month and wraps December to January', () => {
		// The middle of a 30-day April is day 15.5 (days are centred on their noon).
		expect(dailyMeanC(miami, 4, 15.5, 30)).toBeCloseTo(miami[3], 10);
		const dec31 = dailyMeanC(miami, 12, 31, 31);
		const jan1 = dailyMeanC(miami, 1, 1, 31);
		expect(Math.abs(dec31 - jan1)).toBeLessThan(0.1);
	});
	it('the monthly average of the interpolated days stays within 0.3 °C of the monthly mean', () => {
		const lengths = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
		lengths.forEach((len, i) => {
			let sum = 0;
			for (let d = 1; d <= len; d++) sum += dailyMeanC(miami, i + 1, d, len);
			expect(Math.abs(sum / len - miami[i])).toBeLessThan(0.3);
		});
	});
});

describe('thermal clock against a day-by-day sum (brute force, independent of the prefix tables)', () => {
	const nsw = findClimate('northern-nsw-coast')!.monthlyMeanC;
	const clock = thermalClockFor(nsw);
	function bruteForce(fromYear: number, days: number): number {
		let sum = 0;
		let day = epochDayFromCivil(fromYear, 1, 1);
		for (let i = 0; i < days; i++, day++) {
			const date = new Date(day * 86_400_000);
			const y = date.getUTCFullYear();
			const m = date.getUTCMonth() + 1;
			const len = new Date(Date.UTC(y, m, 0)).getUTCDate();
			sum += bananaDevelopmentRate(dailyMeanC(nsw, m, date.getUTCDate(), len));
		}
		return sum;
	}
	it('matches a brute-force sum over 1999–2031, across leap years and the 2000 century rule', () => {
		const from = epochDayFromCivil(1999, 1, 1);
		for (const [y, m, d] of [[2000, 3, 1], [2004, 2, 29], [2024, 12, 31], [2031, 7, 4]]) {
			const to = epochDayFromCivil(y, m, d);
			expect(clock.cumulativeAt(to) - clock.cumulativeAt(from)).toBeCloseTo(bruteForce(1999, to - from), 6);
		}
	});
	it('works before 2000 and across 2100 (not a leap year)', () => {
		const a = epochDayFromCivil(2099, 1, 1);
		const b = epochDayFromCivil(2101, 1, 1);
		expect(clock.cumulativeAt(b) - clock.cumulativeAt(a)).toBeCloseTo(2 * annualThermalTime(nsw), 6);
		expect(clock.cumulativeAt(epochDayFromCivil(1990, 1, 1))).toBeLessThan(0);
	});
	it('dayReaching is the inverse of cumulativeAt', () => {
		const start = epochDayFromCivil(2026, 3, 10);
		for (const dd of [0.5, 100, 1234.5, 5000, 20000]) {
			const target = clock.cumulativeAt(start) + dd;
			const day = clock.dayReaching(target, start);
			expect(clock.cumulativeAt(day)).toBeLessThan(target);
			expect(clock.cumulativeAt(day + 1)).toBeGreaterThanOrEqual(target);
		}
	});
});
