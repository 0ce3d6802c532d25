/**
 * A plant's stages and the name of each stem of a mat: one set of words for every page, the
 * chart legend, the guides, the calendar and the e-mail. Trade words where the trade has them
 * (follower, flowering, bunch, cut back); plain words otherwise.
 */
import type { IsoDate, Plan, Step } from './types';
import type { StepKind } from './vocabulary';

export const PLANT_STAGES = [
	{ id: 'planted', label: 'Just planted', explanation: 'Settling in: set at pot depth in full sun, the soil kept moist to the touch.' },
	{ id: 'growing-leaves', label: 'Growing leaves', explanation: 'A new leaf every week or two in warm weather; feeding starts after the second new leaf.' },
	{ id: 'followers-out', label: 'Followers out', explanation: 'Suckers show at the base: keep one or two as followers and thin the rest.' },
	{ id: 'flowering', label: 'Flowering and bunch filling', explanation: 'The short flag leaf, then the flower pushes out (shooting) and the bunch fills for months.' },
	{ id: 'ready', label: 'Ready to harvest', explanation: 'The fingers are plump and just colouring: cut the bunch and ripen it in the shade.' },
	{ id: 'cut-back', label: 'Cut back', explanation: 'The fruited stem is cut back, then down to the ground, and feeds its follower.' },
	{ id: 'handed-on', label: 'Handed on to its follower', explanation: 'The stem is gone; its follower carries the mat on.' },
	{ id: 'lost', label: 'Lost', explanation: 'The stem died or was removed before its time; a follower may still carry the mat on.' }
] as const;
export type PlantStage = (typeof PLANT_STAGES)[number]['id'];
export const PLANT_STAGE_IDS = PLANT_STAGES.map((s) => s.id) as PlantStage[];

/** Narrows a stored stage (a text column) to the vocabulary. */
export const isPlantStage = (value: string): value is PlantStage => (PLANT_STAGE_IDS as string[]).includes(value);

export function stageLabel(stage: PlantStage): string {
	return PLANT_STAGES.find((s) => s.id === stage)!.label;
}

/** The stage a step belongs to; feeding runs through the whole life of the mat, so it has none. */
export const STAGE_OF_STEP: Readonly<Record<Exclude<StepKind, 'feeding'>, PlantStage>> = {
	planting: 'planted',
	followers: 'followers-out',
	thinning: 'followers-out',
	division: 'followers-out',
	'flag-leaf': 'flowering',
	shooting: 'flowering',
	'bud-removal': 'flowering',
	harvest: 'ready',
	ripening: 'ready',
	'cut-back': 'cut-back',
	'stem-removal': 'cut-back'
};

/** The one name of each stem of a mat: the plant sold, then "Follower 1", "Follower 2", … */
export function generationLabel(generation: number): string {
	return generation === 0 ? 'Your plant' : `Follower ${generation}`;
}

/** The same name inside a sentence ("your plant", "follower 1"). */
export function generationName(generation: number): string {
	const label = generationLabel(generation);
	return label[0].toLowerCase() + label.slice(1);
}

function firstOf(steps: Step[], kind: StepKind): Step | undefined {
	return steps.find((s) => s.kind === kind);
}

/**
 * The stage a stem is in on a day, read off its plan (logged dates where there are any, else the
 * likely dates): null before planting. Feeding starts at the second new leaf, which is when the
 * plant is growing leaves; it is ready to harvest from the opening of the harvest window.
 */
export function stageOn(plan: Plan, today: IsoDate, generation = 0): PlantStage | null {
	const lost = plan.lost?.find((l) => l.generation === generation);
	if (lost && lost.on <= today) return 'lost';
	const own = plan.steps.filter((s) => s.generation === generation);
	const birth = generation === 0 ? firstOf(own, 'planting')?.likely : plan.steps.find((s) => s.kind === 'followers' && s.generation === generation - 1)?.likely;
	if (birth === undefined || today < birth) return null;
	const harvest = firstOf(own, 'harvest');
	const starts: [PlantStage, IsoDate | undefined][] = [
		['planted', birth],
		['growing-leaves', generation === 0 ? firstOf(plan.steps, 'feeding')?.likely : birth],
		['followers-out', firstOf(own, 'followers')?.likely],
		['flowering', firstOf(own, 'flag-leaf')?.likely ?? firstOf(own, 'shooting')?.likely],
		['ready', harvest?.observed ? undefined : harvest?.earliest],
		['cut-back', firstOf(own, 'cut-back')?.likely],
		['handed-on', firstOf(own, 'stem-removal')?.likely]
	];
	let stage: PlantStage = 'planted';
	for (const [id, start] of starts) if (start !== undefined && start <= today) stage = id;
	return stage;
}
