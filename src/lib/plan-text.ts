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
