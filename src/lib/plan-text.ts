/**
 * How a plan reads to people: dates, amounts, nutrients and stage colours. Shared by the
 * planner page, the plant page and the calendar feed so a step says the same thing everywhere.
 */
import type { Amount, IsoDate, Nutrients, Step, StepKind } from '$lib/care';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

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

export function generationLabel(generation: number): string {
	return generation === 0 ? 'Plant as sold' : generation === 1 ? 'First follower' : `Follower ${generation}`;
}

export type Stage = 'planting' | 'feeding' | 'mat' | 'flowering' | 'harvest' | 'clean-up';

export const STAGE_OF: Readonly<Record<StepKind, Stage>> = {
	planting: 'planting',
	feeding: 'feeding',
	followers: 'mat',
	thinning: 'mat',
	division: 'mat',
	'flag-leaf': 'flowering',
	shooting: 'flowering',
	'bud-removal': 'flowering',
	harvest: 'harvest',
	ripening: 'harvest',
	'cut-back': 'clean-up',
	'stem-removal': 'clean-up'
};

/** Palette colours (tailwind.config.ts) per stage; SVG needs the values, not class names. */
export const STAGES: readonly { stage: Stage; label: string; colour: string }[] = [
	{ stage: 'planting', label: 'Planting', colour: '#2b5c28' },
	{ stage: 'feeding', label: 'Feeding', colour: '#8cc083' },
	{ stage: 'mat', label: 'Followers and division', colour: '#a88b74' },
	{ stage: 'flowering', label: 'Flag leaf and shooting', colour: '#8e2f45' },
	{ stage: 'harvest', label: 'Harvest and ripening', colour: '#eabb3b' },
	{ stage: 'clean-up', label: 'Cut-back and clean-up', colour: '#4a3628' }
];
