/**
 * The feeding ramp, per mat (one to four plants share one ration; common practice, no source):
 * a handful at the second new leaf, half a can a month later, a full can the month after,
 * then a full can every month.
 */
import type { FeedingSettings, Step, Units } from './types';
import { addMonths, formatIsoDate, monthOf, type EpochDay } from './dates';
import { CAUTION, cautions } from './cautions';
import { nitrogenRateKgPer100m2, nutrientsFor, elementalGrams, validateNpk } from './nutrients';
import { feedingText, nitrogenCapCaution, restrictionCaution } from './wording';
import { GRAMS_PER_POUND, GRAMS_PER_OUNCE, toUnits } from './units';

export const defaultFeeding: FeedingSettings = {
	// High-potassium analysis, K2O ≈ 2 × N (common practice, no source).
	npk: [8, 10, 16],
	// The nursery's 2-lb can, level full.
	fullRationG: 2 * GRAMS_PER_POUND,
	// A gardener's handful of granules, about 100 g (from memory).
	handfulG: 100,
	restrictedMonths: []
};

export interface Ration {
	grams: number;
	measure: string;
}

/** Name of the can from its mass: "2-lb" when it is a whole number of pounds, else its metric or ounce mass. */
export function canLabel(fullRationG: number, units: Units): string {
	const pounds = fullRationG / GRAMS_PER_POUND;
	if (Math.abs(pounds - Math.round(pounds)) < 0.01 && Math.round(pounds) >= 1) return `${Math.round(pounds)}-lb`;
	return units === 'metric' ? `${Math.round(fullRationG)} g` : `${Math.round(fullRationG / GRAMS_PER_OUNCE)}-oz`;
}

/** The ration of the `index`-th feeding (0-based) on the ramp. */
export function rationFor(index: number, settings: FeedingSettings, units: Units): Ration {
	const can = canLabel(settings.fullRationG, units);
	if (index === 0) return { grams: settings.handfulG, measure: '1 handful' };
	if (index === 1) return { grams: settings.fullRationG / 2, measure: `½ can (${can})` };
	return { grams: settings.fullRationG, measure: `1 can (${can})` };
}

export function validateFeeding(settings: FeedingSettings): void {
	validateNpk(settings.npk);
	const masses = [settings.fullRationG, settings.handfulG];
	if (!masses.every((m) => Number.isFinite(m) && m >= 0)) throw new RangeError('Feeding masses must be finite and ≥ 0 g.');
	if (!settings.restrictedMonths.every((m) => Number.isInteger(m) && m >= 1 && m <= 12)) {
		throw new RangeError('Restricted months are integers 1–12.');
	}
}

/** Warning when one application, spread over the mat's footprint, passes the local nitrogen cap. */
function nitrogenCapWarning(grams: number, settings: FeedingSettings): string | undefined {
	const cap = settings.nitrogenCapKgPer100m2;
	const area = settings.matFootprintM2;
	if (cap === undefined || area === undefined || !(area > 0)) return undefined;
	const rate = nitrogenRateKgPer100m2(elementalGrams(grams, settings.npk).n, area);
	if (rate <= cap) return undefined;
	return nitrogenCapCaution(rate, area, cap);
}

export interface FeedingWindow {
	earliest: EpochDay;
	likely: EpochDay;
	latest: EpochDay;
}

/** Monthly feedings from the first one until the last planned plant is gone. */
export function feedingSteps(first: FeedingWindow, horizonEnd: EpochDay, settings: FeedingSettings, units: Units, guide: string): Step[] {
	const steps: Step[] = [];
	for (let k = 0; ; k++) {
		const likely = addMonths(first.likely, k);
		if (k > 0 && likely > horizonEnd) break;
		steps.push(feedingStep(k, { earliest: addMonths(first.earliest, k), likely, latest: addMonths(first.latest, k) }, settings, units, guide));
	}
	return steps;
}

function feedingStep(index: number, window: FeedingWindow, settings: FeedingSettings, units: Units, guide: string): Step {
	const ration = rationFor(index, settings, units);
	const text = feedingText(index, ration.measure, settings.npk);
	const month = monthOf(window.likely);
	const restricted = settings.restrictedMonths.includes(month);
	const extra = [restricted ? restrictionCaution(month) : undefined, nitrogenCapWarning(ration.grams, settings)].filter(
		(c): c is string => c !== undefined
	);
	const step: Step = {
		kind: 'feeding',
		title: text.title,
		detail: text.detail,
		earliest: formatIsoDate(window.earliest),
		likely: formatIsoDate(window.likely),
		latest: formatIsoDate(window.latest),
		generation: 0,
		amount: { ...toUnits(ration.grams, units), measure: ration.measure },
		nutrients: nutrientsFor(ration.grams, settings.npk, units),
		cautions: cautions(CAUTION.fertilizer, ...extra),
		guide
	};
	if (restricted) step.restricted = { reason: restrictionCaution(month), skippable: true };
	return step;
}
