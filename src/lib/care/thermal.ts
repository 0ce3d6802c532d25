/**
 * Thermal time: the plant's development clock.
 *
 * Banana development follows accumulated warmth rather than the calendar, so every forecast in
 * the plan is a distance in degree-days converted back to a calendar day through a climate's
 * "thermal clock" (cumulative degree-days since 2000-01-01).
 */
import { daysInMonth, epochDayFromCivil, isLeapYear, type EpochDay } from './dates';

/** Daily degree-days from a daily mean temperature, °C → °C·d. */
export type DevelopmentResponse = (meanC: number) => number;

/**
 * Shape of the banana response used by the engine, °C.
 * - base 14 °C: CIRAD's base temperature for banana (Jullien, Chillet & Malézieux 2001).
 * - floor 10 °C … blend 18 °C: a quadratic tail (T−10)²/16 that meets T−14 at 18 °C with the same
 *   slope. Chosen because monthly means hide warm afternoons: a month averaging 12–14 °C still moves
 *   the plant on a little in the garden, while development stops near 10 °C.
 * - optimum plateau 31–33 °C, then linear decline to nothing at 38 °C (heat stress).
 */
export const BANANA_RESPONSE = {
	floorC: 10,
	baseC: 14,
	blendTopC: 18,
	optimumLowC: 31,
	optimumHighC: 33,
	ceilingC: 38
} as const;

export function bananaDevelopmentRate(meanC: number): number {
	const r = BANANA_RESPONSE;
	if (!(meanC > r.floorC) || meanC >= r.ceilingC) return 0;
	if (meanC < r.blendTopC) {
		// a·(T − floor)² with slope 1 at blendTop; since blendTop − floor = 2·(blendTop − base),
		// its value there is also blendTop − base, so the tail joins T − base smoothly.
		const above = meanC - r.floorC;
		return (above * above) / (2 * (r.blendTopC - r.floorC));
	}
	if (meanC <= r.optimumLowC) return meanC - r.baseC;
	const plateau = r.optimumLowC - r.baseC;
	if (meanC <= r.optimumHighC) return plateau;
	return (plateau * (r.ceilingC - meanC)) / (r.ceilingC - r.optimumHighC);
}

/**
 * Leaf emission (the plant's development up to shooting) against the day's mean, °C → °C·d.
 * Allen, Dettmann, Johns & Turner ("Estimation of leaf emergence rates of bananas", Aust. J.
 * Agric. Res. 39:53, 1988; title from memory) fitted leaf emission of Cavendish to monthly means
 * from about 13 °C, with its optimum near 28.5 °C; their coefficients are not reproduced here.
 * Monthly means hide warm afternoons, so a month averaging 14–16 °C still moves a plant on: the
 * response runs linearly from `baseC` to the optimum, holds to 33 °C (the plateau's upper end is
 * the one `BANANA_RESPONSE` uses) and falls to nothing at 38 °C. `baseC` (9 °C) is fitted to the
 * published anchors in docs/calibration.md, not taken from a source: at 10 °C an autumn planting
 * at Alstonville flowers later than Turner's 1972 figure allows, and every half degree lower
 * shortens Tenerife's later bunches towards the 11 months of the Canarian figure.
 */
export const LEAF_RESPONSE = {
	baseC: 9,
	optimumLowC: 28.5,
	optimumHighC: 33,
	ceilingC: 38
} as const;

export function leafEmissionRate(meanC: number): number {
	const r = LEAF_RESPONSE;
	if (!(meanC > r.baseC) || meanC >= r.ceilingC) return 0;
	const plateau = r.optimumLowC - r.baseC;
	if (meanC <= r.optimumLowC) return meanC - r.baseC;
	if (meanC <= r.optimumHighC) return plateau;
	return (plateau * (r.ceilingC - meanC)) / (r.ceilingC - r.optimumHighC);
}

/** A plain linear degree-day response above `baseC`, floored at 0. */
export function linearResponse(baseC: number): DevelopmentResponse {
	return (meanC) => Math.max(0, meanC - baseC);
}

/** McMaster & Wilhelm (1997) method 1: average of Tmax and Tmin minus the base, floored at 0. */
export function degreeDaysMethod1(tMaxC: number, tMinC: number, baseC: number): number {
	return Math.max(0, (tMaxC + tMinC) / 2 - baseC);
}

/**
 * McMaster & Wilhelm (1997) method 2: Tmax and Tmin are each raised to the base (and, if given,
 * lowered to an upper threshold) before averaging.
 */
export function degreeDaysMethod2(tMaxC: number, tMinC: number, baseC: number, upperC = Infinity): number {
	const clip = (t: number) => Math.min(upperC, Math.max(baseC, t));
	return (clip(tMaxC) + clip(tMinC)) / 2 - baseC;
}

/**
 * Daily mean temperature on a calendar day from 12 monthly means. Each monthly mean is placed at
 * the middle of its month and a periodic Catmull-Rom spline runs through them (Dec wraps to Jan),
 * which is smooth, passes through every monthly value and shifts exactly when all months shift.
 */
export function dailyMeanC(monthlyMeanC: readonly number[], month: number, day: number, monthLength: number): number {
	let position = month - 1 + (day - 0.5) / monthLength - 0.5;
	if (position < 0) position += 12;
	const i = Math.floor(position);
	const t = position - i;
	const p0 = monthlyMeanC[(i + 11) % 12];
	const p1 = monthlyMeanC[i % 12];
	const p2 = monthlyMeanC[(i + 1) % 12];
	const p3 = monthlyMeanC[(i + 2) % 12];
	const spline =
		0.5 *
		(2 * p1 +
			(p2 - p0) * t +
			(2 * p0 - 5 * p1 + 4 * p2 - p3) * t * t +
			(3 * p1 - p0 - 3 * p2 + p3) * t * t * t);
	// A spline overshoots between a cold and a hot month; past the optimum that would make a
	// cooler garden develop faster. Kept between its two monthly means, it cannot.
	return Math.min(Math.max(spline, Math.min(p1, p2)), Math.max(p1, p2));
}

/** Degree-days in each day of a year (365 or 366 entries). */
function dailyTable(monthlyMeanC: readonly number[], leap: boolean, response: DevelopmentResponse): Float64Array {
	const table = new Float64Array(leap ? 366 : 365);
	const year = leap ? 2000 : 2001;
	let k = 0;
	for (let month = 1; month <= 12; month++) {
		const length = daysInMonth(year, month);
		for (let day = 1; day <= length; day++) table[k++] = response(dailyMeanC(monthlyMeanC, month, day, length));
	}
	return table;
}

function prefixSums(daily: Float64Array): Float64Array {
	const prefix = new Float64Array(daily.length + 1);
	for (let i = 0; i < daily.length; i++) prefix[i + 1] = prefix[i] + daily[i];
	return prefix;
}

/** Leap years in [1, year − 1]; Gregorian rule. */
function leapYearsBefore(year: number): number {
	const y = year - 1;
	return Math.floor(y / 4) - Math.floor(y / 100) + Math.floor(y / 400);
}

const EPOCH_YEAR = 2000;
const LEAPS_BEFORE_EPOCH = leapYearsBefore(EPOCH_YEAR);

export interface ThermalClock {
	/** Degree-days accumulated from 2000-01-01 up to the start of `day`. */
	cumulativeAt(day: EpochDay): number;
	/**
	 * The calendar day during which the accumulated degree-days reach `target`,
	 * never before `notBefore`.
	 */
	dayReaching(target: number, notBefore: EpochDay): EpochDay;
	/** Degree-days in a common (non-leap) year. */
	readonly commonYear: number;
}

/**
 * Builds the clock from a common-year and a leap-year table: a year's position only changes in
 * February, so two prefix tables plus a closed form over whole years give any date exactly,
 * and the inverse is a year estimate plus a binary search over at most 367 entries.
 */
export function createThermalClock(monthlyMeanC: readonly number[], response: DevelopmentResponse = bananaDevelopmentRate): ThermalClock {
	validateMonthlyMeans(monthlyMeanC);
	const commonPrefix = prefixSums(dailyTable(monthlyMeanC, false, response));
	const leapPrefix = prefixSums(dailyTable(monthlyMeanC, true, response));
	const commonYear = commonPrefix[365];
	const leapYear = leapPrefix[366];
	const meanYear = commonYear + (97 / 400) * (leapYear - commonYear);

	const yearStart = (year: number): number =>
		(year - EPOCH_YEAR) * commonYear + (leapYearsBefore(year) - LEAPS_BEFORE_EPOCH) * (leapYear - commonYear);

	const cumulativeAt = (day: EpochDay): number => {
		// Year of `day`: approximate then correct, avoiding a Date round-trip on the hot path.
		let year = EPOCH_YEAR + Math.floor((day - 10957) / 365.2425);
		while (epochDayFromCivil(year, 1, 1) > day) year--;
		while (epochDayFromCivil(year + 1, 1, 1) <= day) year++;
		const prefix = isLeapYear(year) ? leapPrefix : commonPrefix;
		return yearStart(year) + prefix[day - epochDayFromCivil(year, 1, 1)];
	};

	const firstDayAtLeast = (target: number): EpochDay => {
		if (!(meanYear > 0)) throw new RangeError('This climate never warms enough for a banana to develop.');
		let year = EPOCH_YEAR + Math.floor(target / meanYear);
		while (yearStart(year) > target) year--;
		while (yearStart(year + 1) <= target) year++;
		const prefix = isLeapYear(year) ? leapPrefix : commonPrefix;
		const start = yearStart(year);
		let lo = 0;
		let hi = prefix.length - 1;
		while (lo < hi) {
			const mid = (lo + hi) >> 1;
			// Same sum as cumulativeAt, so a target read off the clock maps back to its own day.
			if (start + prefix[mid] >= target) hi = mid;
			else lo = mid + 1;
		}
		// Whole-year sums and in-year sums can disagree in the last bit; settle the answer on
		// cumulativeAt itself so a stretch of zero-development days maps to its first day.
		let day = epochDayFromCivil(year, 1, 1) + lo;
		while (cumulativeAt(day - 1) >= target) day--;
		while (cumulativeAt(day) < target) day++;
		return day;
	};

	return {
		cumulativeAt,
		// The day during which the sum crosses the target is the one before the first day whose
		// start-of-day total has reached it.
		dayReaching: (target, notBefore) => Math.max(notBefore, firstDayAtLeast(target) - 1),
		commonYear
	};
}

export function validateMonthlyMeans(monthlyMeanC: readonly number[]): void {
	if (monthlyMeanC.length !== 12 || !monthlyMeanC.every((t) => Number.isFinite(t) && t > -60 && t < 60)) {
		throw new RangeError('A climate needs 12 finite monthly mean temperatures in °C, January first.');
	}
}

/** Degree-days of the banana response over a common year of the given climate. */
export function annualThermalTime(monthlyMeanC: readonly number[], response: DevelopmentResponse = bananaDevelopmentRate): number {
	validateMonthlyMeans(monthlyMeanC);
	return prefixSums(dailyTable(monthlyMeanC, false, response))[365];
}

const CLOCK_CACHE_LIMIT = 256;

/**
 * A cache of clocks per climate. The cache only saves work: a clock is a pure function of the
 * 12 numbers, so evicting or keeping an entry never changes a plan.
 */
function cachedClocks(response: DevelopmentResponse): (monthlyMeanC: readonly number[]) => ThermalClock {
	const cache = new Map<string, ThermalClock>();
	return (monthlyMeanC) => {
		const key = monthlyMeanC.join(',');
		const cached = cache.get(key);
		if (cached) return cached;
		const clock = createThermalClock(monthlyMeanC, response);
		if (cache.size >= CLOCK_CACHE_LIMIT) {
			const oldest = cache.keys().next().value;
			if (oldest !== undefined) cache.delete(oldest);
		}
		cache.set(key, clock);
		return clock;
	};
}

/** The bunch-filling clock of a climate (base 14 °C, `bananaDevelopmentRate`). */
export const thermalClockFor = cachedClocks(bananaDevelopmentRate);

/** The leaf clock of a climate (`leafEmissionRate`): leaves, followers and shooting run on it. */
export const leafClockFor = cachedClocks(leafEmissionRate);
