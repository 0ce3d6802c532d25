import { describe, expect, it } from 'vitest';
import convert from 'convert-units';
import { K2O_TO_K, P2O5_TO_P, elementalGrams, nitrogenRateKgPer100m2, nutrientsFor } from '../../../src/lib/care/nutrients';
import { GRAMS_PER_OUNCE } from '../../../src/lib/care/units';

// IUPAC standard atomic weights (abridged): P 30.974, O 15.999, K 39.098.
const P = 30.974;
const O = 15.999;
const K = 39.098;

describe('oxide → element factors, Virginia Tech SPES-201NP; Penn State Extension turf fertilizer factsheet', () => {
	it('P2O5 → P is 0.4364 and K2O → K is 0.8301', () => {
		expect(P2O5_TO_P).toBe(0.4364);
		expect(K2O_TO_K).toBe(0.8301);
	});
	it('agree with the mass fractions from IUPAC standard atomic weights (the published factors are cut to 4 decimals)', () => {
		expect(Math.abs((2 * P) / (2 * P + 5 * O) - P2O5_TO_P)).toBeLessThan(1e-4);
		expect(Math.abs((2 * K) / (2 * K + O) - K2O_TO_K)).toBeLessThan(1e-4);
	});
});

describe('elemental nutrients of an application', () => {
	it('100 g of 8-10-16 supplies 8 g N, 4.364 g P, 13.28 g K', () => {
		const e = elementalGrams(100, [8, 10, 16]);
		expect(e.n).toBeCloseTo(8, 10);
		expect(e.p).toBeCloseTo(10 * 0.4364, 10);
		expect(e.k).toBeCloseTo(16 * 0.8301, 10);
	});
	it('imperial figures are in ounces (oz via convert-units)', () => {
		const n = nutrientsFor(907.18474, [8, 10, 16], 'imperial');
		expect(n.unit).toBe('oz');
		expect(n.n).toBeCloseTo(convert(907.18474 * 0.08).from('g').to('oz'), 2);
		expect(n.k).toBeCloseTo((907.18474 * 0.16 * 0.8301) / GRAMS_PER_OUNCE, 2);
	});
	it('rejects an impossible analysis', () => {
		expect(() => elementalGrams(100, [60, 30, 20])).toThrow(RangeError);
		expect(() => elementalGrams(100, [-1, 0, 0])).toThrow(RangeError);
	});
});

describe('nitrogen cap, Orange County FL Code §15-804: 1 lb N per 1,000 ft² per application', () => {
	it('equals about 0.488 kg N per 100 m² (exact NIST factors, and again through convert-units)', () => {
		const exact = nitrogenRateKgPer100m2(453.59237, 1000 * 0.3048 * 0.3048);
		expect(exact).toBeCloseTo(0.488, 3);
		const viaLibrary = nitrogenRateKgPer100m2(convert(1).from('lb').to('g'), convert(1000).from('ft2').to('m2'));
		expect(viaLibrary).toBeCloseTo(0.488, 3);
	});
});
