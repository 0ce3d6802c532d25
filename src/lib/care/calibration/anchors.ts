/**
 * The published figures the engine is calibrated to (issue 10), one check per figure. Each names
 * its source (author, title, year), the station whose normals stand for the place, the cultivar
 * the engine plants, and the range the engine must land in. A single published number is widened
 * by 15 % either side; a published range is used as it stands. Plants go in at age 0 (a young
 * plant or sucker set out), as in the trade's own rule of thumb.
 */

/** What the engine is asked, in the unit of the published figure. */
export type Measure =
	/** Planting to the flower (bunch emergence), months, for plantings on the 15th of `months`. */
	| 'planting-to-shooting'
	/** Planting to the mother's harvest, months. */
	| 'planting-to-harvest'
	/** Planting to the mother's stem removal (her whole life), months. */
	| 'planting-to-stem-removal'
	/** Planting to the first followers, months. */
	| 'planting-to-followers'
	/** A logged flower on the 15th of `months` to the harvest, days. */
	| 'shooting-to-harvest'
	/** Harvest to the next harvest on the same mat (mother → follower 1 → follower 2), months. */
	| 'ratoon-interval';

export const MEASURE_UNIT: Readonly<Record<Measure, 'months' | 'days'>> = {
	'planting-to-shooting': 'months',
	'planting-to-harvest': 'months',
	'planting-to-stem-removal': 'months',
	'planting-to-followers': 'months',
	'shooting-to-harvest': 'days',
	'ratoon-interval': 'months'
};

export const MEASURE_NAMES: Readonly<Record<Measure, string>> = {
	'planting-to-shooting': 'planting to flower',
	'planting-to-harvest': 'planting to harvest',
	'planting-to-stem-removal': 'planting to stem removal',
	'planting-to-followers': 'planting to followers',
	'shooting-to-harvest': 'flower to harvest',
	'ratoon-interval': 'harvest to next harvest'
};

export interface Check {
	id: string;
	place: string;
	/** The station whose normals stand for the place (stations.ts). */
	station: string;
	cultivar: string;
	measure: Measure;
	/** The months (1–12) of planting, or of flowering for `shooting-to-harvest`. */
	months: readonly number[];
	/**
	 * `each`: every month's likely result must be inside; `mean`: their mean (a typical cycle);
	 * `covers`: the plan's windows over the months must span the whole published range (where the
	 * sources disagree, the plan should show the spread rather than pick a point); `reaches`: every
	 * month's window must reach into the published range (where one source disagrees with the
	 * others, the plan's window holds it without moving the likely date away from the rest).
	 */
	statistic: 'each' | 'mean' | 'covers' | 'reaches';
	/** The figure as published. */
	figure: string;
	/** The range the engine must land in, in the measure's unit. */
	range: readonly [number, number];
	/** How `range` follows from the figure. */
	rangeNote: string;
	source: string;
	/**
	 * Set when the engine is known to fall outside and why: the check then reports the miss
	 * instead of failing, and the test asserts that it is still outside (so a fix is noticed).
	 * Only another reading of a figure may be a known miss: `otherReadingOf` names the check of
	 * the reading that is met.
	 */
	outsideBecause?: string;
	otherReadingOf?: string;
}

const ALL_MONTHS = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12] as const;
const widened = (figure: number): readonly [number, number] => [round1(figure * 0.85), round1(figure * 1.15)];
const ONE_NUMBER = 'one number, widened by 15 %';
const AS_PUBLISHED = 'the published range';

function round1(x: number): number {
	return Math.round(x * 10) / 10;
}

const AUSTRALIAN_BANANAS = 'Australian Banana Growers’ Council, “Growing” (australianbananas.com.au), page undated';
const CTAHR = 'University of Hawaiʻi CTAHR, Crop Knowledge Master, “Banana”, page undated';
const LASSOUDIERE = 'Lassoudière A. & Maubert P., Fruits 26:321, 1971 (title not recalled)';
const TURNER_1972 = 'Turner D.W., “Banana plant growth”, Aust. J. Exp. Agric. Anim. Husb. 12:209, 1972 (title from memory)';
const CANARIAN = 'a Canarian growers’ article on open-air banana growing (weak source: used as a range)';
const IFAS = 'UF/IFAS Pinellas County extension agent, article on home bananas, 2016';
const TRADE = 'the trade’s rule of thumb (common practice, no source)';

export const checks: readonly Check[] = [
	{
		id: 'trade-followers',
		place: 'Warm subtropical coast (the reference climate)',
		station: 'miami',
		cultivar: 'grand-nain',
		measure: 'planting-to-followers',
		months: ALL_MONTHS,
		statistic: 'mean',
		figure: 'followers at about 6 months',
		range: widened(6),
		rangeNote: `${ONE_NUMBER}; averaged over the planting months (a year of warmth is not spread evenly)`,
		source: TRADE
	},
	{
		id: 'trade-shooting',
		place: 'Warm subtropical coast (the reference climate)',
		station: 'miami',
		cultivar: 'grand-nain',
		measure: 'planting-to-shooting',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: 'flower at about 12 months',
		range: widened(12),
		rangeNote: ONE_NUMBER,
		source: TRADE
	},
	{
		id: 'trade-fill',
		place: 'Warm subtropical coast (the reference climate)',
		station: 'miami',
		cultivar: 'grand-nain',
		measure: 'shooting-to-harvest',
		months: ALL_MONTHS,
		statistic: 'mean',
		figure: 'fruit about 4 months after the flower',
		range: [round1(4 * 0.85 * (365.2425 / 12)), round1(4 * 1.15 * (365.2425 / 12))],
		rangeNote: `${ONE_NUMBER}; averaged over the flowering months (summer bunches fill faster, winter ones slower)`,
		source: TRADE
	},
	{
		id: 'trade-life',
		place: 'Warm subtropical coast (the reference climate)',
		station: 'miami',
		cultivar: 'grand-nain',
		measure: 'planting-to-stem-removal',
		months: ALL_MONTHS,
		statistic: 'mean',
		figure: '16–17 months of life',
		range: [16, 17],
		rangeNote: `${AS_PUBLISHED}, averaged over the planting months`,
		source: TRADE
	},
	{
		id: 'north-queensland-first-bunch',
		place: 'North Queensland coast (Innisfail–Tully)',
		station: 'innisfail',
		cultivar: 'williams',
		measure: 'planting-to-shooting',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: 'first bunch about 12 months after planting (read as the bunch emerging)',
		range: widened(12),
		rangeNote: ONE_NUMBER,
		source: AUSTRALIAN_BANANAS
	},
	{
		id: 'north-queensland-first-bunch-as-harvest',
		place: 'North Queensland coast (Innisfail–Tully)',
		station: 'innisfail',
		cultivar: 'williams',
		measure: 'planting-to-harvest',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: 'first bunch about 12 months after planting (read as the bunch harvested)',
		range: widened(12),
		rangeNote: ONE_NUMBER,
		source: AUSTRALIAN_BANANAS,
		otherReadingOf: 'north-queensland-first-bunch',
		outsideBecause:
			'Read as a harvest, the figure cannot be met together with the trade’s 16–17 months of life in the reference climate: Innisfail’s normals are cooler than Miami’s in every month of the sorted year, so no temperature-driven model harvests there 3 or more months sooner. A commercial plantation (tissue-culture plants, irrigation, fertigation) also runs ahead of a garden.'
	},
	{
		id: 'north-queensland-ratoon',
		place: 'North Queensland coast (Innisfail–Tully)',
		station: 'innisfail',
		cultivar: 'williams',
		measure: 'ratoon-interval',
		months: ALL_MONTHS,
		statistic: 'mean',
		figure: 'then a bunch every 8–10 months',
		range: [8, 10],
		rangeNote: `${AS_PUBLISHED}, for the typical cycle: the mean over plantings in every month and the first two followers`,
		source: AUSTRALIAN_BANANAS
	},
	{
		id: 'north-queensland-ratoon-each',
		place: 'North Queensland coast (Innisfail–Tully)',
		station: 'innisfail',
		cultivar: 'williams',
		measure: 'ratoon-interval',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: 'every single interval, against the 8–15 months the tropical and Canarian figures span together',
		range: [8, 15],
		rangeNote: 'the union of the two published ratoon ranges',
		source: `${AUSTRALIAN_BANANAS}; ${CANARIAN}`
	},
	{
		id: 'honolulu-flowering',
		place: 'Hawaiʻi, Honolulu lowlands',
		station: 'honolulu',
		cultivar: 'grand-nain',
		measure: 'planting-to-shooting',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: 'flowering 9–12 months after planting',
		range: [9, 12],
		rangeNote: AS_PUBLISHED,
		source: CTAHR
	},
	{
		id: 'honolulu-fill',
		place: 'Hawaiʻi, Honolulu lowlands',
		station: 'honolulu',
		cultivar: 'grand-nain',
		measure: 'shooting-to-harvest',
		months: ALL_MONTHS,
		statistic: 'reaches',
		figure: 'fruit ready 60–90 days after the flowers appear (read as ready to cut: the harvest window opens by then)',
		range: [60, 90],
		rangeNote: `${AS_PUBLISHED}; the window, not the likely day, because Aboisso, warmer in every month, reports about 108 days`,
		source: CTAHR
	},
	{
		id: 'honolulu-fill-ripe',
		place: 'Hawaiʻi, Honolulu lowlands',
		station: 'honolulu',
		cultivar: 'grand-nain',
		measure: 'shooting-to-harvest',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: 'fruit ready 60–90 days after the flowers appear (read as the home harvest, the plan’s likely day)',
		range: [60, 90],
		rangeNote: AS_PUBLISHED,
		source: CTAHR,
		otherReadingOf: 'honolulu-fill',
		outsideBecause:
			'The anchors disagree: Aboisso (Lassoudière & Maubert) is warmer than Honolulu in every month yet reports about 108 days, and the trade’s 4 months holds in a reference climate as warm as Honolulu. The likely day is the home harvest (fingers plump and just colouring), 1.45 times the commercial grade’s thermal time; the plan’s window opens at the commercial grade, when the bunch may be cut green, and that opening is inside the 60–90 days (the check above).'
	},
	{
		id: 'aboisso-fill',
		place: 'Aboisso, Côte d’Ivoire (humid tropics)',
		station: 'abidjan',
		cultivar: 'williams',
		measure: 'shooting-to-harvest',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: 'Poyo (Cavendish) harvested on about day 108 after bunch emergence',
		range: widened(108),
		rangeNote: ONE_NUMBER,
		source: LASSOUDIERE
	},
	{
		id: 'alstonville-emergence',
		place: 'Alstonville, New South Wales (cool subtropical)',
		station: 'alstonville',
		cultivar: 'williams',
		measure: 'planting-to-shooting',
		months: [11],
		statistic: 'each',
		figure: 'planted November 1967, bunch emergence about May 1969 (about 18 months)',
		range: widened(18),
		rangeNote: ONE_NUMBER,
		source: TURNER_1972
	},
	{
		id: 'alstonville-emergence-every-season',
		place: 'Alstonville, New South Wales (cool subtropical)',
		station: 'alstonville',
		cultivar: 'williams',
		measure: 'planting-to-shooting',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: 'the same 18 months, held for plantings in every month (an extrapolation: the trial planted in November only)',
		range: widened(18),
		rangeNote: ONE_NUMBER,
		source: TURNER_1972
	},
	{
		id: 'tenerife-first-cut',
		place: 'Tenerife, Canary Islands, open air',
		station: 'santa-cruz-de-tenerife',
		cultivar: 'grand-nain',
		measure: 'planting-to-harvest',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: 'planting to first cut 15–24 months',
		range: [15, 24],
		rangeNote: AS_PUBLISHED,
		source: CANARIAN
	},
	{
		id: 'tenerife-first-cut-window',
		place: 'Tenerife, Canary Islands, open air',
		station: 'santa-cruz-de-tenerife',
		cultivar: 'grand-nain',
		measure: 'planting-to-harvest',
		months: ALL_MONTHS,
		statistic: 'covers',
		figure: 'planting to first cut 15–24 months: the plan’s harvest windows should span it',
		range: [15, 24],
		rangeNote: AS_PUBLISHED,
		source: CANARIAN
	},
	{
		id: 'tenerife-ratoon',
		place: 'Tenerife, Canary Islands, open air',
		station: 'santa-cruz-de-tenerife',
		cultivar: 'grand-nain',
		measure: 'ratoon-interval',
		months: ALL_MONTHS,
		statistic: 'mean',
		figure: 'later bunches every 11–15 months',
		range: [11, 15],
		rangeNote: `${AS_PUBLISHED}, for the typical cycle: the mean over plantings in every month and the first two followers`,
		source: CANARIAN
	},
	{
		id: 'tenerife-ratoon-each',
		place: 'Tenerife, Canary Islands, open air',
		station: 'santa-cruz-de-tenerife',
		cultivar: 'grand-nain',
		measure: 'ratoon-interval',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: 'every single interval, against the 8–15 months the tropical and Canarian figures span together',
		range: [8, 15],
		rangeNote: 'the union of the two published ratoon ranges',
		source: `${AUSTRALIAN_BANANAS}; ${CANARIAN}`
	},
	{
		id: 'tenerife-fill',
		place: 'Tenerife, Canary Islands, open air',
		station: 'santa-cruz-de-tenerife',
		cultivar: 'grand-nain',
		measure: 'shooting-to-harvest',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: 'emergence to harvest 4–7 months',
		range: [round1(4 * (365.2425 / 12)), round1(7 * (365.2425 / 12))],
		rangeNote: AS_PUBLISHED,
		source: CANARIAN
	},
	{
		id: 'pinellas-fill',
		place: 'Pinellas County, Florida (cool-winter subtropical)',
		station: 'st-petersburg-fl',
		cultivar: 'grand-nain',
		measure: 'shooting-to-harvest',
		months: ALL_MONTHS,
		statistic: 'each',
		figure: '2½ to 6 months from flower to mature fruit, depending on temperature',
		range: [round1(2.5 * (365.2425 / 12)), round1(6 * (365.2425 / 12))],
		rangeNote: AS_PUBLISHED,
		source: IFAS
	}
];
