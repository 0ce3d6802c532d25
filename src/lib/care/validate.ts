/**
 * What the engine refuses, as issues naming the field (a path into PlanInput). The zod schemas
 * call `observedIssues` for the rules between dates, so the API, the calendar, the planner and the
 * plant page all refuse the same inputs with the same words; computePlan throws PlanInputError,
 * which every route turns into a 400.
 */
import type { Observed, PlanInput } from './types';
import { parseIsoDate } from './dates';
import { MIN_ANNUAL_DEGREE_DAYS, NEW_LEAVES_BEFORE_FEEDING } from './model';
import { MONTHLY_MEAN_RANGE_TEXT, PLAN_BOUNDS } from './vocabulary';

export interface PlanInputIssue {
	path: (string | number)[];
	message: string;
}

const b = PLAN_BOUNDS;
/** The words of each refusal, shared with the zod schemas so every path says the same. */
export const BOUND_MESSAGES = {
	ageAtPlantingWeeks: `Enter a whole number of weeks from ${b.ageAtPlantingWeeks.min} to ${b.ageAtPlantingWeeks.max}`,
	monthlyMeanC: `Enter a temperature from ${MONTHLY_MEAN_RANGE_TEXT}`,
	monthlyMeans: 'Give exactly 12 monthly mean temperatures, January first',
	leaves: `Enter a whole number of leaves from ${b.leafCount.min} to ${b.leafCount.max}`,
	generations: `Plan from ${b.generations.min} to ${b.generations.max} generations`
} as const;

/** A year of this climate is too cool for a banana to fruit: the refusal, or undefined. */
export function coolClimateIssue(annualDegreeDays: number): string | undefined {
	if (annualDegreeDays >= MIN_ANNUAL_DEGREE_DAYS) return undefined;
	return `Too cool for a banana to fruit: these means give about ${Math.round(annualDegreeDays)} °C·d a year, and at least ${MIN_ANNUAL_DEGREE_DAYS} are needed`;
}

export class PlanInputError extends RangeError {
	constructor(public issues: PlanInputIssue[]) {
		super(issues.map((i) => `${i.path.join('.') || 'input'}: ${i.message}`).join('; '));
		this.name = 'PlanInputError';
	}
}

/** Logged milestones in the order a stem lives them; each must fall on or after the ones before it. */
const LIFE_ORDER = ['flagLeafOn', 'shotOn', 'harvestedOn', 'cutBackOn', 'stemRemovedOn'] as const;
type DatedMilestone = (typeof LIFE_ORDER)[number] | 'followersOn' | 'lostOn';

export const MILESTONE_NAMES: Readonly<Record<DatedMilestone | 'leafCount', string>> = {
	leafCount: 'A leaf count',
	followersOn: 'Followers',
	flagLeafOn: 'The flag leaf',
	shotOn: 'Shooting',
	harvestedOn: 'Harvest',
	cutBackOn: 'Cut-back',
	stemRemovedOn: 'Stem removal',
	lostOn: 'The loss'
};

const DATED: readonly DatedMilestone[] = ['followersOn', ...LIFE_ORDER, 'lostOn'];

function lowerFirst(s: string): string {
	return s[0].toLowerCase() + s.slice(1);
}

/** ISO dates from a checked calendar compare correctly as strings. */
function isCalendarDate(iso: string): boolean {
	try {
		parseIsoDate(iso);
		return true;
	} catch {
		return false;
	}
}

export function dateIssue(iso: unknown): string | undefined {
	if (typeof iso !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(iso)) return 'Enter a date as YYYY-MM-DD';
	if (!isCalendarDate(iso)) return 'No such date on the calendar';
	const year = Number(iso.slice(0, 4));
	if (year < PLAN_BOUNDS.year.min || year > PLAN_BOUNDS.year.max) return `Enter a year between ${PLAN_BOUNDS.year.min} and ${PLAN_BOUNDS.year.max}`;
	return undefined;
}

function addYears(iso: string, years: number): string {
	return `${String(Number(iso.slice(0, 4)) + years).padStart(4, '0')}${iso.slice(4)}`;
}

/** The rules of one stem's log: real dates, not before planting, within reach, in life order. */
function stemIssues(plantedOn: string, observed: Observed, generation: number, at: (string | number)[]): PlanInputIssue[] {
	const issues: PlanInputIssue[] = [];
	const withinYears = PLAN_BOUNDS.loggedYearsPerGeneration * (generation + 1);
	const latest = addYears(plantedOn, withinYears);
	const dates: Partial<Record<DatedMilestone | 'leafCount', string>> = {};
	const check = (field: DatedMilestone | 'leafCount', iso: unknown, path: (string | number)[]) => {
		const bad = dateIssue(iso);
		if (bad) return void issues.push({ path, message: bad });
		const day = iso as string;
		if (day < plantedOn) issues.push({ path, message: `${MILESTONE_NAMES[field]} cannot come before planting` });
		else if (day > latest) issues.push({ path, message: `Give a date within ${withinYears} years of planting` });
		else dates[field] = day;
	};
	for (const field of DATED) if (observed[field] !== undefined) check(field, observed[field], [...at, field]);
	if (observed.leafCount !== undefined) {
		const { on, leaves } = observed.leafCount;
		check('leafCount', on, [...at, 'leafCount', 'on']);
		const { min, max } = PLAN_BOUNDS.leafCount;
		if (!(Number.isInteger(leaves) && leaves >= min && leaves <= max)) issues.push({ path: [...at, 'leafCount', 'leaves'], message: BOUND_MESSAGES.leaves });
	}
	for (let j = 1; j < LIFE_ORDER.length; j++) {
		const later = dates[LIFE_ORDER[j]];
		if (later === undefined) continue;
		const earlier = LIFE_ORDER.slice(0, j).find((f) => dates[f] !== undefined && dates[f]! > later);
		if (earlier) issues.push({ path: [...at, LIFE_ORDER[j]], message: `${MILESTONE_NAMES[LIFE_ORDER[j]]} cannot come before ${lowerFirst(MILESTONE_NAMES[earlier])}` });
	}
	return issues;
}

/** Every rule about logged milestones, for the plant sold and each follower. */
export function observedIssues(plantedOn: string, observed: Observed | undefined, observedFollowers: Observed[] | undefined = []): PlanInputIssue[] {
	const issues = observed ? stemIssues(plantedOn, observed, 0, ['observed']) : [];
	observedFollowers.forEach((o, i) => issues.push(...stemIssues(plantedOn, o ?? {}, i + 1, ['observedFollowers', i])));
	return issues;
}

/** How many generations the plan covers: as asked, and at least every follower with a log. */
export function generationsOf(input: Pick<PlanInput, 'generations' | 'observedFollowers'>): number {
	return Math.max(input.generations ?? PLAN_BOUNDS.generations.default, (input.observedFollowers?.length ?? 0) + 1);
}

/** Everything computePlan refuses, before it does any work. `annualDegreeDays` is the climate's year. */
export function planInputIssues(input: PlanInput, annualDegreeDays: () => number): PlanInputIssue[] {
	const issues: PlanInputIssue[] = [];
	const planted = dateIssue(input.plantedOn);
	if (planted) issues.push({ path: ['plantedOn'], message: planted });
	const age = input.ageAtPlantingWeeks;
	if (!(Number.isInteger(age) && age >= b.ageAtPlantingWeeks.min && age <= b.ageAtPlantingWeeks.max)) {
		issues.push({ path: ['ageAtPlantingWeeks'], message: BOUND_MESSAGES.ageAtPlantingWeeks });
	}
	const generations = generationsOf(input);
	if (!(Number.isInteger(generations) && generations >= b.generations.min && generations <= b.generations.max)) {
		issues.push({ path: ['generations'], message: BOUND_MESSAGES.generations });
	}
	const means = input.climate.monthlyMeanC;
	if (!Array.isArray(means) || means.length !== 12) issues.push({ path: ['climate', 'monthlyMeanC'], message: BOUND_MESSAGES.monthlyMeans });
	else {
		means.forEach((t, i) => {
			if (!(Number.isFinite(t) && t >= b.monthlyMeanC.min && t <= b.monthlyMeanC.max)) {
				issues.push({ path: ['climate', 'monthlyMeanC', i], message: BOUND_MESSAGES.monthlyMeanC });
			}
		});
	}
	if (input.cultivar.leavesToShooting.value < NEW_LEAVES_BEFORE_FEEDING + 1) issues.push({ path: ['cultivar'], message: 'leavesToShooting is too small' });
	if (issues.length > 0) return issues;
	const tooCool = coolClimateIssue(annualDegreeDays());
	if (tooCool) issues.push({ path: ['climate', 'monthlyMeanC'], message: tooCool });
	return [...issues, ...observedIssues(input.plantedOn, input.observed, input.observedFollowers)];
}
