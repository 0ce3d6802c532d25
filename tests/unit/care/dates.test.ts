import { describe, expect, it } from 'vitest';
import { addMonths, civilFromEpochDay, epochDayFromCivil, formatIsoDate, parseIsoDate } from '../../../src/lib/care/dates';

// Checked against the JavaScript Date object in UTC (ECMA-262 proleptic Gregorian calendar).
describe('calendar arithmetic vs Date.UTC', () => {
	it('epoch days match Date.UTC for every day of 1999–2032', () => {
		for (let t = Date.UTC(1999, 0, 1); t <= Date.UTC(2032, 11, 31); t += 86_400_000) {
			const d = new Date(t);
			const day = t / 86_400_000;
			expect(epochDayFromCivil(d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate())).toBe(day);
			expect(formatIsoDate(day)).toBe(d.toISOString().slice(0, 10));
		}
		expect(civilFromEpochDay(0)).toEqual({ year: 1970, month: 1, day: 1 });
	});
	it('parses only real YYYY-MM-DD dates', () => {
		expect(parseIsoDate('2024-02-29')).toBe(Date.UTC(2024, 1, 29) / 86_400_000);
		expect(() => parseIsoDate('2023-02-29')).toThrow(RangeError);
		expect(() => parseIsoDate('2023-2-1')).toThrow(RangeError);
	});
	it('adds calendar months, clamping to the month’s end', () => {
		expect(formatIsoDate(addMonths(parseIsoDate('2025-01-31'), 1))).toBe('2025-02-28');
		expect(formatIsoDate(addMonths(parseIsoDate('2024-01-31'), 1))).toBe('2024-02-29');
		expect(formatIsoDate(addMonths(parseIsoDate('2025-11-15'), 3))).toBe('2026-02-15');
	});
});
