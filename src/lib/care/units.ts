/**
 * Unit handling. Exact international definitions (NIST Handbook 44 / SP 811):
 * 1 lb = 0.45359237 kg, 1 oz = 1/16 lb = 28.349523125 g, 1 ft = 0.3048 m.
 */
import type { Amount, Units } from './types';

export const GRAMS_PER_POUND = 453.59237;
export const GRAMS_PER_OUNCE = GRAMS_PER_POUND / 16;
export const METRES_PER_FOOT = 0.3048;
export const SQUARE_METRES_PER_SQUARE_FOOT = METRES_PER_FOOT * METRES_PER_FOOT;

function roundTo(value: number, step: number): number {
	return Math.round(value / step) * step;
}

/** Tidies binary noise such as 0.30000000000000004 so amounts read as typed. */
function tidy(value: number, decimals: number): number {
	return Number(value.toFixed(decimals));
}

/**
 * A mass in the gardener's units: metric → g (kg from 1000 g); imperial → oz (lb from 16 oz).
 * Rounded to what a kitchen scale shows: 1 g, 0.01 kg, 0.1 oz, 0.01 lb.
 */
export function toUnits(grams: number, units: Units): Amount {
	if (!(grams >= 0) || !Number.isFinite(grams)) throw new RangeError(`Mass must be a finite number ≥ 0 g, got ${grams}`);
	if (units === 'metric') {
		const g = roundTo(grams, 1);
		return g >= 1000 ? { value: tidy(grams / 1000, 2), unit: 'kg' } : { value: tidy(g, 0), unit: 'g' };
	}
	const oz = tidy(roundTo(grams / GRAMS_PER_OUNCE, 0.1), 1);
	return oz >= 16 ? { value: tidy(grams / GRAMS_PER_POUND, 2), unit: 'lb' } : { value: oz, unit: 'oz' };
}

/** Mass for nutrient figures: grams (metric) or ounces (imperial), finer rounding than toUnits. */
export function smallMass(grams: number, units: Units): number {
	return units === 'metric' ? tidy(grams, 1) : tidy(grams / GRAMS_PER_OUNCE, 2);
}

/** "about 1.2 m (4 ft)" or "about 4 ft (1.2 m)": the gardener's system first. */
export function lengthPhrase(metres: number, feet: number, units: Units): string {
	return units === 'metric' ? `about ${metres} m (${feet} ft)` : `about ${feet} ft (${metres} m)`;
}

export function temperaturePhrase(celsius: number, units: Units): string {
	const fahrenheit = Math.round((celsius * 9) / 5 + 32);
	return units === 'metric' ? `${celsius} °C (${fahrenheit} °F)` : `${fahrenheit} °F (${celsius} °C)`;
}

export function massPhrase(kilograms: number, units: Units): string {
	const pounds = Math.round((kilograms * 1000) / GRAMS_PER_POUND);
	return units === 'metric' ? `${kilograms} kg` : `${pounds} lb`;
}
