/**
 * Why a stored plan was regenerated, and how a move reads to the gardener: "Harvest moved 12 days
 * later because the flower was logged on 14 Mar 2027". Pure: the words for the plant page and the API.
 */
import type { IsoDate } from '$lib/care';
import { formatDay } from '$lib/plan-text';
import { MILESTONE_PHRASES, type MilestoneKind } from './milestones';

export const CHANGE_CAUSES = [
	'created',
	'milestone-logged',
	'milestone-corrected',
	'milestone-deleted',
	'planting-date',
	'climate',
	'units',
	'catalogue',
	'feeding-settings',
	'engine'
] as const;
export type ChangeCauseKind = (typeof CHANGE_CAUSES)[number];

export interface ChangeCause {
	kind: ChangeCauseKind;
	/** For milestone causes: which milestone and the day it was logged for. */
	milestoneKind?: MilestoneKind;
	on?: IsoDate;
}

export function describeCause(cause: ChangeCause): string {
	const milestone = cause.milestoneKind ? MILESTONE_PHRASES[cause.milestoneKind] : 'a milestone';
	const day = cause.on ? ` on ${formatDay(cause.on)}` : '';
	switch (cause.kind) {
		case 'created':
			return 'the plan was made';
		case 'milestone-logged':
			return `${milestone} was logged${day}`;
		case 'milestone-corrected':
			return `${milestone} was corrected to${day || ' a new day'}`;
		case 'milestone-deleted':
			return `${milestone}${day ? ` logged${day}` : ''} was deleted`;
		case 'planting-date':
			return `the planting date was changed${cause.on ? ` to ${formatDay(cause.on)}` : ''}`;
		case 'climate':
			return 'the garden climate was changed';
		case 'units':
			return 'the units were changed';
		case 'catalogue':
			return "the nursery updated the cultivar's figures";
		case 'feeding-settings':
			return "the nursery changed its fertilizer or the local feeding rules";
		case 'engine':
			return 'Bunchline’s care model was updated';
	}
}

/** "12 days later", "3 days earlier", "1 day later". */
export function describeShift(days: number): string {
	const n = Math.abs(days);
	return `${n} ${n === 1 ? 'day' : 'days'} ${days > 0 ? 'later' : 'earlier'}`;
}
