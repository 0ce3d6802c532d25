/**
 * Milestones: what a gardener logs about a stem of the mat. One vocabulary for the database enum,
 * the zod schemas, the log page and the API; and the one mapping from a plant's milestones to the
 * engine's observed inputs, so every logged day re-times the plan the same way.
 */
import { GRAMS_PER_POUND, type IsoDate, type Observed, type Units } from '$lib/care';

export const MILESTONE_KINDS = [
	'leaves',
	'followers',
	'flag-leaf',
	'shooting',
	'harvest',
	'cut-back',
	'stem-removed',
	'division',
	'lost'
] as const;
export type MilestoneKind = (typeof MILESTONE_KINDS)[number];

/** How each kind reads on the log page, in the trade's words. */
export const MILESTONE_LABELS: Readonly<Record<MilestoneKind, string>> = {
	leaves: 'New leaves counted',
	followers: 'Followers seen',
	'flag-leaf': 'Flag leaf out',
	shooting: 'Shooting (flower out)',
	harvest: 'Bunch harvested',
	'cut-back': 'Stem cut back',
	'stem-removed': 'Old stem removed',
	division: 'Division replanted',
	lost: 'Plant lost'
};

/** The same event inside a sentence: "because the flower was logged on 14 Mar 2027". */
export const MILESTONE_PHRASES: Readonly<Record<MilestoneKind, string>> = {
	leaves: 'the leaf count',
	followers: 'the followers',
	'flag-leaf': 'the flag leaf',
	shooting: 'the flower',
	harvest: 'the harvest',
	'cut-back': 'the cut-back',
	'stem-removed': 'the stem removal',
	division: 'the division',
	lost: 'the loss'
};

export const LOSS_REASONS = ['cold', 'wind', 'disease', 'other'] as const;
export type LossReason = (typeof LOSS_REASONS)[number];
export const LOSS_REASON_LABELS: Readonly<Record<LossReason, string>> = {
	cold: 'Cold',
	wind: 'Wind',
	disease: 'Disease',
	other: 'Something else'
};

/**
 * Bounds of the values a milestone carries (`from memory`: a bunch rarely has more than about 20
 * hands, and even the largest cultivars' bunches stay well under 100 kg; a stem puts out a few dozen leaves).
 */
export const MILESTONE_BOUNDS = {
	leaves: { min: 0, max: 80 },
	hands: { min: 1, max: 30 },
	bunchMassKg: { min: 0.1, max: 150 },
	noteLength: 1000
} as const;

/** What the plan needs of a logged milestone. */
export interface LoggedMilestone {
	id: number;
	kind: MilestoneKind;
	/** Which stem of the mat: 0 the plant as sold, 1 its first follower, … */
	generation: number;
	on: IsoDate;
	leaves?: number | null;
}

export interface ObservedInputs {
	observed: Observed;
	/** Observed inputs of the followers: index 0 is generation 1. */
	observedFollowers: Observed[];
}

/** Later logs of the same kind win: a second shooting date on one stem corrects the first. */
function byDay(a: LoggedMilestone, b: LoggedMilestone): number {
	return a.on < b.on ? -1 : a.on > b.on ? 1 : a.id - b.id;
}

/**
 * The engine's observed inputs from a plant's milestones, per generation. A division re-times
 * nothing on this plant: it starts a plant of its own.
 */
export function observedInputs(milestones: readonly LoggedMilestone[]): ObservedInputs {
	const perGeneration: Observed[] = [];
	for (const m of [...milestones].sort(byDay)) {
		const o = (perGeneration[m.generation] ??= {});
		switch (m.kind) {
			case 'leaves':
				if (m.leaves != null) o.leafCount = { on: m.on, leaves: m.leaves };
				break;
			case 'followers':
				o.followersOn ??= m.on; // the first sighting starts the follower's life
				break;
			case 'flag-leaf':
				o.flagLeafOn = m.on;
				break;
			case 'shooting':
				o.shotOn = m.on;
				break;
			case 'harvest':
				o.harvestedOn = m.on;
				break;
			case 'cut-back':
				o.cutBackOn = m.on;
				break;
			case 'stem-removed':
				o.stemRemovedOn = m.on;
				break;
			case 'lost':
				o.lostOn = m.on;
				break;
			case 'division':
				break;
		}
	}
	const [observed = {}, ...followers] = perGeneration;
	return { observed, observedFollowers: Array.from(followers, (o) => o ?? {}) };
}

/**
 * The stem that carries the mat now: a harvest or a loss on a stem hands the mat on to its
 * follower, so the plant page and the nursery's table follow the stem that is growing.
 */
export function currentGeneration(milestones: readonly Pick<LoggedMilestone, 'kind' | 'generation'>[]): number {
	let generation = 0;
	const ended = new Set(milestones.filter((m) => m.kind === 'harvest' || m.kind === 'lost').map((m) => m.generation));
	while (ended.has(generation)) generation++;
	return generation;
}

/** A bunch's weight as the gardener typed it (kg, or lb in imperial) in grams, as stored. */
export function bunchMassGrams(value: number, units: Units): number {
	return Math.round(units === 'imperial' ? value * GRAMS_PER_POUND : value * 1000);
}

/** The unit the gardener types a bunch's weight in. */
export const bunchMassUnit = (units: Units) => (units === 'imperial' ? 'lb' : 'kg');

/** "23.5 kg", "51.8 lb". */
export function bunchMassText(grams: number, units: Units): string {
	const value = units === 'imperial' ? grams / GRAMS_PER_POUND : grams / 1000;
	return `${Math.round(value * 10) / 10} ${bunchMassUnit(units)}`;
}
