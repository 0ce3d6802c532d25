import { describe, expect, it } from 'vitest';
import convert from 'convert-units';
import { GRAMS_PER_OUNCE, GRAMS_PER_POUND, METRES_PER_FOOT, toUnits } from '../../../src/lib/care/units';

describe('exact factors, NIST Handbook 44 Appendix C / NIST SP 811 (international pound, foot)', () => {
	it('1 lb = 0.45359237 kg, 1 oz = 28.349523125 g, 1 ft = 0.3048 m', () => {
		expect(GRAMS_PER_POUND / 1000).toBe(0.45359237);
		expect(GRAMS_PER_OUNCE).toBeCloseTo(28.349523125, 12);
		expect(METRES_PER_FOOT).toBe(0.3048);
	});
});

describe('the same conversions through convert-units 2 (general-purpose library, 453.592 g/lb anchor)', () => {
	it('lb → kg, oz → g, ft → m agree to the library’s precision', () => {
		expect(convert(1).from('lb').to('kg')).toBeCloseTo(GRAMS_PER_POUND / 1000, 5);
		expect(convert(1).from('oz').to('g')).toBeCloseTo(GRAMS_PER_OUNCE, 4);
		expect(convert(1).from('ft').to('m')).toBeCloseTo(METRES_PER_FOOT, 6);
		expect(convert(4).from('ft').to('m')).toBeCloseTo(1.2, 1);
	});
	it('toUnits agrees with convert-units for imperial amounts', () => {
		for (const g of [50, 100, 250, 453.59237, 907.18474, 2000]) {
			const a = toUnits(g, 'imperial');
			const expected = convert(g).from('g').to(a.unit);
			expect(Math.abs(a.value - expected)).toBeLessThanOrEqual(a.unit === 'oz' ? 0.05 : 0.005);
		}
	});
});

describe('toUnits: the gardener’s units', () => {
	it('metric: g below 1000 g, kg from 1000 g', () => {
		expect(toUnits(100, 'metric')).toEqual({ value: 100, unit: 'g' });
		expect(toUnits(907.18474, 'metric')).toEqual({ value: 907, unit: 'g' });
		expect(toUnits(999.6, 'metric')).toEqual({ value: 1, unit: 'kg' });
		expect(toUnits(1814.37, 'metric')).toEqual({ value: 1.81, unit: 'kg' });
	});
	it('imperial: oz below 16 oz, lb from 16 oz (half a 2-lb can is 1 lb)', () => {
		expect(toUnits(100, 'imperial')).toEqual({ value: 3.5, unit: 'oz' });
		expect(toUnits(453.59237, 'imperial')).toEqual({ value: 1, unit: 'lb' });
		expect(toUnits(907.18474, 'imperial')).toEqual({ value: 2, unit: 'lb' });
	});
	it('rejects negative masses', () => {
		expect(() => toUnits(-1, 'metric')).toThrow(RangeError);
	});
});
