/**
 * What a care card prints of a plan: the first weeks only (planting, the first feedings), each
 * with its week after planting, since the buyer may plant on another day than the card assumes.
 * Pure, so the card and its tests agree.
 */
import { parseIsoDate, type IsoDate, type Plan, type StepKind } from './care';

export interface CardStep {
	kind: StepKind;
	title: string;
	detail: string;
	likely: IsoDate;
	/** Whole weeks from planting to the step's likely day (0 = the planting week). */
	week: number;
}

/** Steps of the plant as sold (and the mat's feedings) within the first `weeks` after planting, at most `most`. */
export function firstWeeks(plan: Plan, plantedOn: IsoDate, weeks = 12, most = 4): CardStep[] {
	const start = parseIsoDate(plantedOn);
	return plan.steps
		.filter((s) => s.generation === 0 || s.kind === 'feeding')
		.map((s) => ({ kind: s.kind, title: s.title, detail: s.detail, likely: s.likely, week: Math.floor((parseIsoDate(s.likely) - start) / 7) }))
		.filter((s) => s.week >= 0 && s.week <= weeks)
		.slice(0, most);
}

/** "in the planting week", "about 5 weeks after planting". */
export function weekText(week: number): string {
	if (week === 0) return 'in the planting week';
	return week === 1 ? 'about 1 week after planting' : `about ${week} weeks after planting`;
}

/** A6 is one card a page; "sheet" fits four cards on A4 or US letter (2 × 2, 100 × 135 mm each). */
export const CARD_LAYOUTS = ['a6', 'sheet'] as const;
export type CardLayout = (typeof CARD_LAYOUTS)[number];
export const cardLayout = (value: string | null): CardLayout => (value === 'sheet' ? 'sheet' : 'a6');
