/**
 * Development model: calibration constants and one function per rule of the trade.
 *
 * Calibration: the trade's timings (followers ≈ 6 months, shooting ≈ 12 months after 50–60 leaves,
 * fruit ready ≈ 4 months after the flower, mother's life ≈ 16–17 months — common practice, no
 * source) hold for a warm subtropical garden. They are converted once into thermal time on the
 * reference climate, so any other climate stretches or shrinks every interval by its own warmth.
 */
import type { Cultivar } from './types';
import { referenceClimate } from './catalogue/climates';
import { referenceCultivar } from './catalogue/cultivars';
import { LEAF_RESPONSE, annualThermalTime, leafEmissionRate } from './thermal';

/**
 * Leaf-clock degree-days (`leafEmissionRate`) in a common year of the reference climate: the
 * thermal length of the trade's "12 months". Every month count below is on this clock; only
 * bunch filling runs on the base-14 °C clock of its published thermal time.
 */
export const REFERENCE_YEAR_DEGREE_DAYS = annualThermalTime(referenceClimate().monthlyMeanC, leafEmissionRate);

/** Thermal length of a reference-climate month: converts the trade's month counts to thermal time. */
export const REFERENCE_MONTH_DEGREE_DAYS = REFERENCE_YEAR_DEGREE_DAYS / 12;

/**
 * Months from planting (age 0) to shooting of the reference cultivar in the reference climate.
 * The trade says "about 12 months" (common practice, no source); 11.7 is fitted inside that so
 * the North Queensland coast, a little cooler than the reference, still shows its first bunch by
 * about 12 months (Australian Bananas, "Growing"; docs/calibration.md) and Honolulu flowers within
 * the 9–12 months CTAHR reports.
 */
export const REFERENCE_SHOOTING_MONTHS = 11.7;

/** Leaves per degree-day of the reference cultivar, so it shoots at REFERENCE_SHOOTING_MONTHS in the reference. */
export const LEAVES_PER_DEGREE_DAY = referenceCultivar().leavesToShooting.value / (REFERENCE_SHOOTING_MONTHS * REFERENCE_MONTH_DEGREE_DAYS);

/** Followers show at about 6 months of age (common practice, no source). */
export const FOLLOWERS_AGE_DEGREE_DAYS = 6 * REFERENCE_MONTH_DEGREE_DAYS;

/** Surplus suckers are thinned once they can be told apart, about 2 months after the first show (common practice, no source). */
export const THINNING_AFTER_FOLLOWERS_DEGREE_DAYS = 2 * REFERENCE_MONTH_DEGREE_DAYS;

/** A surplus sucker reaches about waist height some 4 months after emerging (common practice, no source). */
export const WAIST_HEIGHT_AFTER_FOLLOWERS_DEGREE_DAYS = 4 * REFERENCE_MONTH_DEGREE_DAYS;

/** The last hands open and the male bud can be snapped off about 2 weeks after shooting (common practice, no source). */
export const BUD_REMOVAL_AFTER_SHOOTING_DEGREE_DAYS = (14 / 365) * REFERENCE_YEAR_DEGREE_DAYS;

/**
 * Published flowering-to-harvest thermal times describe the commercial (export) harvest grade.
 * A home grower waits until the fingers are plump and just colouring, later than that grade
 * (common practice, no source). 1.45 is fitted to the anchors in docs/calibration.md: it puts
 * Aboisso's bunches at 104–120 days (Lassoudière & Maubert 1971: about 108), Tenerife's at 4–7
 * months and Pinellas' at 3–6 months whatever month they flower in. Tenerife's shortest (June
 * flowers, 124 days against 122) and Pinellas' longest (October flowers, 178 days against 183)
 * sit within days of their published bounds, so this factor has little room either way.
 */
export const HOME_RIPENESS_FACTOR = 1.45;

/**
 * The temperature at which a published base-13.9 °C thermal time is carried over to the
 * development clock: Umber et al. measured theirs in the warm tropics, where a day near 27 °C
 * gives 13.1 °C·d above 13.9 °C. Keeping the duration at 27 °C and counting it on the
 * development clock (base 9 °C) lets cool months fill a bunch at the pace the cool-subtropical
 * anchors report, which a base of 14 °C does not (docs/calibration.md, "Bunch filling").
 */
export const FILL_CARRY_OVER_C = 27;
const PUBLISHED_FILL_BASE_C = 13.9;

/**
 * A follower grows held back while its mother stands (shaded, and sharing the corm's food) and at
 * the full rate once she is harvested or lost. 0.70 is fitted so the next bunch on a mat comes
 * 8–10 months after the last on the North Queensland coast (Australian Bananas, "Growing") and
 * 11–15 months in the Canary Islands, averaged over the planting months (docs/calibration.md).
 */
export const HELD_BACK_RATE = 0.7;

/** Stem removal at ground level about 2 weeks after the cut-back (common practice, no source). */
export const STEM_REMOVAL_AFTER_CUT_BACK_DAYS = 14;

/** Feeding starts once the plant has put out two new leaves (common practice, no source). */
export const NEW_LEAVES_BEFORE_FEEDING = 2;

/**
 * Window half-width as a share of the thermal time since the last known fact: 6 % for the plant
 * sold, 4 % more per generation, because each follower inherits its parent's uncertainty.
 */
export const WINDOW_SHARE_BASE = 0.06;
export const WINDOW_SHARE_PER_GENERATION = 0.04;
const WINDOW_SHARE_MAX = 0.5;

/**
 * Cooler gardens get wider windows. The published record spreads widest where bananas are
 * marginal: the Canarian growers report 15 to 24 months from planting to first cut, against the
 * tropical figures' few weeks either side of a year. What spreads it there is what the plan does
 * not know: a cool season warmer or colder than the normal, the delay short days put on the
 * flower in the subtropics (Turner, Fortescue & Thomas, Braz. J. Plant Physiol. 19:463, 2007),
 * sheltered or exposed sites. The share grows in proportion to how far the garden's year falls
 * short of the reference climate's on the leaf clock (`climateCoolness`); the gain is fitted, not
 * taken from a source: the smallest step of 0.05 at which the plan's harvest windows over
 * plantings in every month span the Canarian range with half a month to spare (0.45 leaves the
 * windows ending at 24.0 months; docs/calibration.md).
 */
export const COOL_WINDOW_GAIN = 0.55;

/**
 * Annual thermal time on the bunch-filling clock (base 14 °C) below which a banana cannot fruit
 * within a human planning horizon: a bunch would take over two years to fill.
 */
export const MIN_ANNUAL_DEGREE_DAYS = 600;

/**
 * How far a garden's year falls short of the reference climate's on the leaf clock: 0 in the
 * reference and anything warmer, approaching 1 as the year approaches nothing.
 */
export function climateCoolness(annualLeafDegreeDays: number): number {
	return Math.max(0, 1 - annualLeafDegreeDays / REFERENCE_YEAR_DEGREE_DAYS);
}

export function windowShare(generation: number, coolness = 0): number {
	return Math.min(WINDOW_SHARE_MAX, WINDOW_SHARE_BASE + WINDOW_SHARE_PER_GENERATION * generation + COOL_WINDOW_GAIN * coolness);
}

export function leavesPerDegreeDay(cultivar: Cultivar): number {
	return LEAVES_PER_DEGREE_DAY * cultivar.leafRateFactor.value;
}

/** Thermal time for a plant to put out `leaves` leaves. */
export function degreeDaysForLeaves(cultivar: Cultivar, leaves: number): number {
	return Math.max(0, leaves) / leavesPerDegreeDay(cultivar);
}

/**
 * Leaves already out when planted, estimated from the thermal time the plant lived before planting.
 * Capped two leaves short of shooting: a nursery plant has not yet reached its flag leaf.
 */
export function leavesAtPlanting(cultivar: Cultivar, thermalAgeDegreeDays: number): number {
	return Math.min(cultivar.leavesToShooting.value - NEW_LEAVES_BEFORE_FEEDING, thermalAgeDegreeDays * leavesPerDegreeDay(cultivar));
}

/**
 * Flowering to the commercial harvest grade, degree-days: the fingers are full enough to cut the
 * bunch green and ripen it off the plant. The published thermal time carried over to the leaf clock.
 */
export function shootingToGreenCutDegreeDays(cultivar: Cultivar): number {
	const carryOver = (FILL_CARRY_OVER_C - LEAF_RESPONSE.baseC) / (FILL_CARRY_OVER_C - PUBLISHED_FILL_BASE_C);
	return cultivar.degreeDaysShootingToHarvest.value * carryOver;
}

/** Flowering to the home harvest (fingers plump and just colouring), degree-days. */
export function shootingToHarvestDegreeDays(cultivar: Cultivar): number {
	return shootingToGreenCutDegreeDays(cultivar) * HOME_RIPENESS_FACTOR;
}
