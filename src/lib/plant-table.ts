/**
 * How a plant reads in the nursery's table, its JSON and its CSV export: pure functions over
 * the plant row, so the page, the API and the file say the same thing.
 */
import { parseIsoDate } from '$lib/care';
import { stageLabel } from '$lib/schema/plant-table';

/** Age today in whole weeks: the age when sold plus the whole weeks since (never less than at sale). */
export function ageInWeeks(soldOn: string, ageAtSaleWeeks: number, today: string): number {
	const days = parseIsoDate(today) - parseIsoDate(soldOn);
	return ageAtSaleWeeks + Math.max(0, Math.floor(days / 7));
}

/** A step is overdue once its day has passed (the plant row keeps the next step not yet done). */
export const isOverdue = (nextStepOn: string | null, today: string): boolean => nextStepOn !== null && nextStepOn < today;

export interface PlantTableItem {
	id: number;
	href: string;
	cultivar: { slug: string; name: string };
	claimed: boolean;
	gardener: string | null;
	soldOn: string;
	ageWeeks: number;
	marketDay: { id: number; on: string; place: string } | null;
	stage: string | null;
	stageLabel: string;
	nextStep: { kind: string; on: string; overdue: boolean } | null;
	lastMilestone: { kind: string; on: string } | null;
	archived: boolean;
}

export interface PlantTablePage {
	plants: PlantTableItem[];
	page: number;
	perPage: number;
	/** Exact when `totalExact`; otherwise the database's estimate, since counting a million rows on every page is too slow. */
	total: number;
	totalExact: boolean;
	/** Pages that can be shown: at most the first TABLE_ROW_LIMIT matching plants. */
	pages: number;
}

/** "flag-leaf" → "Flag leaf": a step or milestone kind as a table cell reads it. */
export const kindLabel = (kind: string): string => (kind.charAt(0).toUpperCase() + kind.slice(1)).replaceAll('-', ' ');

/** The row as stored, joined with its cultivar, gardener and market day. */
export interface PlantTableSource {
	id: number;
	cultivarSlug: string;
	cultivarName: string;
	gardenerName: string | null;
	soldOn: string;
	ageAtSaleWeeks: number;
	marketDayId: number | null;
	marketDayOn: string | null;
	marketPlace: string | null;
	stage: string | null;
	nextStepOn: string | null;
	nextStepKind: string | null;
	lastMilestoneOn: string | null;
	lastMilestoneKind: string | null;
	archivedAt: Date | string | null;
}

export function plantTableItem(row: PlantTableSource, today: string): PlantTableItem {
	return {
		id: row.id,
		href: `/plants/${row.id}`,
		cultivar: { slug: row.cultivarSlug, name: row.cultivarName },
		claimed: row.gardenerName !== null,
		gardener: row.gardenerName,
		soldOn: row.soldOn,
		ageWeeks: ageInWeeks(row.soldOn, row.ageAtSaleWeeks, today),
		marketDay: row.marketDayId !== null && row.marketDayOn !== null ? { id: row.marketDayId, on: row.marketDayOn, place: row.marketPlace ?? '' } : null,
		stage: row.stage,
		stageLabel: stageLabel(row.stage),
		nextStep: row.nextStepOn && row.nextStepKind ? { kind: row.nextStepKind, on: row.nextStepOn, overdue: isOverdue(row.nextStepOn, today) } : null,
		lastMilestone: row.lastMilestoneOn && row.lastMilestoneKind ? { kind: row.lastMilestoneKind, on: row.lastMilestoneOn } : null,
		archived: row.archivedAt !== null
	};
}

/** The export's columns, in order: one header per column, one cell per plant. */
export const EXPORT_COLUMNS: readonly { header: string; cell: (p: PlantTableItem) => string | number }[] = [
	{ header: 'plant', cell: (p) => p.id },
	{ header: 'cultivar', cell: (p) => p.cultivar.name },
	{ header: 'gardener', cell: (p) => p.gardener ?? '' },
	{ header: 'claimed', cell: (p) => (p.claimed ? 'yes' : 'no') },
	{ header: 'sold on', cell: (p) => p.soldOn },
	{ header: 'market day', cell: (p) => p.marketDay?.on ?? '' },
	{ header: 'market', cell: (p) => p.marketDay?.place ?? '' },
	{ header: 'age (weeks)', cell: (p) => p.ageWeeks },
	{ header: 'stage', cell: (p) => p.stageLabel },
	{ header: 'next step', cell: (p) => p.nextStep?.kind ?? '' },
	{ header: 'next step on', cell: (p) => p.nextStep?.on ?? '' },
	{ header: 'overdue', cell: (p) => (p.nextStep?.overdue ? 'yes' : 'no') },
	{ header: 'last milestone', cell: (p) => p.lastMilestone?.kind ?? '' },
	{ header: 'last milestone on', cell: (p) => p.lastMilestone?.on ?? '' },
	{ header: 'archived', cell: (p) => (p.archived ? 'yes' : 'no') }
];
