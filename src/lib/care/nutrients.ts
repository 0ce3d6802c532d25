/**
 * Elemental nutrients from a fertilizer label. Labels give N, P2O5 and K2O (oxide) percentages;
 * the factors below convert oxide to element (Virginia Tech SPES-201NP; Penn State Extension
 * turfgrass fertilizer factsheet).
 */
import type { Nutrients, Units } from './types';
import { smallMass } from './units';

export const P2O5_TO_P = 0.4364;
export const K2O_TO_K = 0.8301;

export function validateNpk(npk: readonly number[]): void {
	const total = npk.reduce((a, b) => a + b, 0);
	if (npk.length !== 3 || !npk.every((x) => Number.isFinite(x) && x >= 0) || total > 100) {
		throw new RangeError('N-P-K must be three percentages ≥ 0 that add up to at most 100.');
	}
}

/** Elemental N, P and K in grams supplied by `grams` of a product with label analysis `npk`. */
export function elementalGrams(grams: number, npk: readonly [number, number, number]): { n: number; p: number; k: number } {
	validateNpk(npk);
	return {
		n: (grams * npk[0]) / 100,
		p: ((grams * npk[1]) / 100) * P2O5_TO_P,
		k: ((grams * npk[2]) / 100) * K2O_TO_K
	};
}

/** Elemental nutrients of an application, in g (metric) or oz (imperial). */
export function nutrientsFor(grams: number, npk: readonly [number, number, number], units: Units): Nutrients {
	const e = elementalGrams(grams, npk);
	return {
		n: smallMass(e.n, units),
		p: smallMass(e.p, units),
		k: smallMass(e.k, units),
		unit: units === 'metric' ? 'g' : 'oz'
	};
}

/** kg of N per 100 m² when `nitrogenGrams` is spread evenly over `areaM2`. */
export function nitrogenRateKgPer100m2(nitrogenGrams: number, areaM2: number): number {
	return nitrogenGrams / 1000 / (areaM2 / 100);
}
