/**
 * The engine's vocabularies and input bounds, exported once. The zod schemas in $lib/schema, the
 * pg enums and the pages derive from these; the engine refuses anything outside them with a
 * PlanInputError naming the field, so every path (API, calendar, planner, plant page) answers 400.
 */

/** Kinds of step, in the order the work happens on one day. */
export const STEP_KINDS = [
	'planting',
	'feeding',
	'followers',
	'thinning',
	'division',
	'flag-leaf',
	'shooting',
	'bud-removal',
	'harvest',
	'ripening',
	'cut-back',
	'stem-removal'
] as const;
export type StepKind = (typeof STEP_KINDS)[number];

export const UNITS = ['metric', 'imperial'] as const;
export type Units = (typeof UNITS)[number];

export const MONTH_NAMES = [
	'January',
	'February',
	'March',
	'April',
	'May',
	'June',
	'July',
	'August',
	'September',
	'October',
	'November',
	'December'
] as const;
export const MONTH_ABBREVIATIONS = MONTH_NAMES.map((m) => m.slice(0, 3));

/**
 * Bounds of every plan input.
 * - ageAtPlantingWeeks: a nursery plant is sold within two years of potting.
 * - monthlyMeanC: outside −30…50 °C a value is a typing slip, not a climate.
 * - generations: the plant sold and at least two followers, at most ten stems.
 * - year: dates outside 1900–2200 are typing slips (e.g. 0226) and would run plans off the calendar.
 * - leafCount: leaves counted on one stem; a banana puts out at most a few dozen before it flowers.
 * - loggedYearsPerGeneration: a milestone of generation g is logged within 10·(g+1) years of
 *   planting; a stem's whole life is well under that, later dates are typing errors.
 */
export const PLAN_BOUNDS = {
	ageAtPlantingWeeks: { min: 0, max: 104 },
	monthlyMeanC: { min: -30, max: 50 },
	generations: { min: 3, max: 10, default: 3 },
	year: { min: 1900, max: 2200 },
	leafCount: { min: 0, max: 80 },
	loggedYearsPerGeneration: 10
} as const;

/** "−30 to 50 °C": a true minus sign reads better than a hyphen, and screen readers say "minus". */
export const MONTHLY_MEAN_RANGE_TEXT = `${String(PLAN_BOUNDS.monthlyMeanC.min).replace('-', '−')} to ${PLAN_BOUNDS.monthlyMeanC.max} °C`;
