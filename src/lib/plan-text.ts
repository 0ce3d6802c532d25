/**
 * How a plan reads to people: dates, amounts, nutrients and stage colours. Shared by the
 * planner page, the plant page and the calendar feed so a step says the same thing everywhere.
 */
import { MONTH_ABBREVIATIONS as MONTHS, PLANT_STAGES, STAGE_OF_STEP, type Amount, type IsoDate, type Nutrients, type PlantStage, type Step } from '$lib/care';

export { generationLabel, generationName, PLANT_STAGES, stageLabel } from '$lib/care';

/** "12 Mar 2027". Written out by hand because Intl would shift a calendar date by the viewer's time zone. */
export function formatDay(iso: IsoDate): string {
	const [y, m, d] = iso.split('-').map(Number);
	return `${d} ${MONTHS[m - 1]} ${y}`;
}

export function formatMonth(iso: IsoDate): string {
	const [y, m] = iso.split('-').map(Number);
	return `${MONTHS[m - 1]} ${y}`;
}

export function formatWindow(step: Pick<Step, 'earliest' | 'latest'>): string {
	return step.earliest === step.latest ? formatDay(step.earliest) : `${formatDay(step.earliest)} – ${formatDay(step.latest)}`;
}

export function formatMass(amount: Amount): string {
	return `${amount.value} ${amount.unit}`;
}

/** "½ can (2-lb), 454 g": the kitchen measure first, because that is what the gardener scoops. */
export function formatAmount(amount: Amount): string {
	return amount.measure ? `${amount.measure}, ${formatMass(amount)}` : formatMass(amount);
}

export function formatNutrients(n: Nutrients): string {
	return `N ${n.n} ${n.unit} · P ${n.p} ${n.unit} · K ${n.k} ${n.unit}`;
}

/** Palette colours (tailwind.config.ts) per plant stage; SVG needs the values, not class names. */
export const STAGE_COLOURS: Readonly<Record<PlantStage, string>> = {
	planted: '#2b5c28',
	'growing-leaves': '#3f7f3a',
	'followers-out': '#a88b74',
	flowering: '#8e2f45',
	ready: '#eabb3b',
	'cut-back': '#4a3628',
	'handed-on': '#6e5340',
	lost: '#3f0f1d'
};

/** Feeding runs through the whole life of the mat, so it has its own colour rather than a stage's. */
export const FEEDING_COLOUR = '#8cc083';

export function stepColour(step: Pick<Step, 'kind'>): string {
	return step.kind === 'feeding' ? FEEDING_COLOUR : STAGE_COLOURS[STAGE_OF_STEP[step.kind]];
}

/** The stages a plan's steps fall in, in life order, for a chart legend. */
export function stagesIn(steps: Pick<Step, 'kind'>[]): (typeof PLANT_STAGES)[number][] {
	const present = new Set(steps.map((s) => (s.kind === 'feeding' ? undefined : STAGE_OF_STEP[s.kind])));
	return PLANT_STAGES.filter((s) => present.has(s.id));
}

/** A run of feedings one month apart with the same ration, nutrients and restriction: one table row. */
export interface FeedingRun {
	first: Step;
	last: Step;
	count: number;
}

function sameRation(a: Step, b: Step): boolean {
	return (
		a.amount?.value === b.amount?.value &&
		a.amount?.unit === b.amount?.unit &&
		a.amount?.measure === b.amount?.measure &&
		a.nutrients?.n === b.nutrients?.n &&
		a.nutrients?.p === b.nutrients?.p &&
		a.nutrients?.k === b.nutrients?.k &&
		Boolean(a.restricted) === Boolean(b.restricted) &&
		(a.cautions ?? []).join('\n') === (b.cautions ?? []).join('\n')
	);
}

/** Whole months from one ISO date to another, by calendar month (days ignored). */
function monthsBetween(a: IsoDate, b: IsoDate): number {
	const [ya, ma] = a.split('-').map(Number);
	const [yb, mb] = b.split('-').map(Number);
	return (yb - ya) * 12 + (mb - ma);
}

/**
 * The plan's feedings as runs: consecutive monthly feedings that ask for the same thing collapse
 * into one row ("monthly, Mar 2027 – Oct 2031, 56 feedings"); the ramp at the start and every
 * restricted month keep rows of their own, because they ask for something different.
 */
export function feedingRuns(steps: Step[]): FeedingRun[] {
	const runs: FeedingRun[] = [];
	for (const step of steps.filter((s) => s.kind === 'feeding' && s.amount)) {
		const run = runs.at(-1);
		if (run && sameRation(run.last, step) && monthsBetween(run.last.likely, step.likely) === 1) {
			run.last = step;
			run.count++;
		} else runs.push({ first: step, last: step, count: 1 });
	}
	return runs;
}

/** Beyond this many years from the first step's likely day to the last's, a plan says why it is so long. */
export const LONG_PLAN_YEARS = 3;

/**
 * Why a plan runs past LONG_PLAN_YEARS, or undefined when it does not. Three stems take about
 * three years in a warm garden; a longer plan means cool months slow every stage down.
 */
export function longPlanNote(steps: Pick<Step, 'likely'>[]): string | undefined {
	if (steps.length === 0) return undefined;
	const first = Math.min(...steps.map((s) => Date.parse(s.likely)));
	const last = Math.max(...steps.map((s) => Date.parse(s.likely)));
	const years = (last - first) / (365.2425 * 86_400_000);
	if (years <= LONG_PLAN_YEARS) return undefined;
	return (
		`This plan runs about ${Math.round(years)} years because the garden is cooler than bananas like. ` +
		'They grow fastest in months averaging about 28 °C and slow right down in months under about 15 °C, so every stage here takes longer ' +
		'than in the tropics, and a bunch that flowers before winter fills slowly. A sunny, sheltered spot (a warm wall, out of cold wind) helps.'
	);
}
