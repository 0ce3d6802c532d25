/** The planner's plan view: timeline layout, the feeding summary and the long-plan note (pure helpers). */
import { describe, expect, it } from 'vitest';
import { computePlan, findClimate, findCultivar, type PlanInput, type Step } from '$lib/care';
import { CHART, labelWidth, timelineLayout, TODAY_FONT, TODAY_LABEL } from '$lib/plan-chart';
import { feedingRuns, longPlanNote, LONG_PLAN_YEARS } from '$lib/plan-text';

function plan(climate: string, plantedOn = '2027-03-15', extra: Partial<PlanInput> = {}) {
	return computePlan({ cultivar: findCultivar('grand-nain')!, climate: findClimate(climate)!, plantedOn, ageAtPlantingWeeks: 12, ...extra }).steps;
}

const cool = plan('southern-california-coast');
const warm = plan('humid-tropical-lowland');
const years = (steps: Step[]) => (Date.parse(steps.at(-1)!.likely) - Date.parse(steps[0].likely)) / (365.2425 * 86_400_000);

describe('timeline layout', () => {
	it('keeps every axis label and the Today label inside the chart, for short and long plans and every planting month', () => {
		for (const steps of [cool, warm, ...Array.from({ length: 12 }, (_, m) => plan('northern-nsw-coast', `2027-${String(m + 1).padStart(2, '0')}-01`))]) {
			const last = steps.at(-1)!.latest;
			for (const today of [steps[0].likely, last]) {
				const layout = timelineLayout(steps, today);
				expect(layout.labels.length).toBeGreaterThan(0);
				for (const label of layout.labels) {
					expect(label.x, label.text).toBeGreaterThanOrEqual(CHART.labelWidth);
					expect(label.x + label.width, `${label.text} right edge`).toBeLessThanOrEqual(CHART.width);
				}
				const half = labelWidth(TODAY_LABEL, TODAY_FONT) / 2;
				expect(layout.todayLabelX! - half).toBeGreaterThanOrEqual(0);
				expect(layout.todayLabelX! + half).toBeLessThanOrEqual(CHART.width);
			}
		}
	});
	it('labels every year of a long plan up to its last, inside the right edge (the label the old chart cut off)', () => {
		const layout = timelineLayout(cool);
		const lastDay = cool.reduce((d, s) => (s.latest > d ? s.latest : d), '');
		const years = layout.labels.filter((l) => l.bold).map((l) => Number(l.text));
		// The axis closes on the month after the last step, so the last January it labels is in the last step's year.
		expect(years.at(-1)).toBe(Number(lastDay.slice(0, 4)));
		years.slice(1).forEach((y, i) => expect(y).toBe(years[i] + 1));
		const lastYear = layout.labels.filter((l) => l.bold).at(-1)!;
		expect(lastYear.x + lastYear.width).toBeLessThanOrEqual(CHART.width);
	});
	it('puts overlapping windows of one generation on separate rows that never touch', () => {
		for (const lane of timelineLayout(cool).lanes) {
			const byRow = new Map<number, { x0: number; x1: number }[]>();
			for (const bar of lane.bars) byRow.set(bar.row, [...(byRow.get(bar.row) ?? []), bar]);
			for (const bars of byRow.values()) {
				const sorted = [...bars].sort((a, b) => a.x0 - b.x0);
				for (let i = 1; i < sorted.length; i++) expect(sorted[i].x0 - sorted[i - 1].x1).toBeGreaterThanOrEqual(CHART.minGap);
			}
		}
	});
});

describe('feeding summary', () => {
	it('a cool garden’s dozens of identical monthly feedings become a handful of rows, covering every feeding once', () => {
		const feedings = cool.filter((s) => s.kind === 'feeding');
		const runs = feedingRuns(cool);
		expect(feedingRuns(cool).reduce((n, r) => n + r.count, 0)).toBe(feedings.length);
		expect(feedings.length).toBeGreaterThan(40);
		// The ramp (a handful, half a can) keeps its own rows; the steady can a month is one row.
		expect(runs.map((r) => r.first.amount!.measure)).toEqual(['1 handful', '½ can (2-lb)', '1 can (2-lb)']);
		expect(runs[2].count).toBe(feedings.length - 2);
		expect(runs[2].last.likely).toBe(feedings.at(-1)!.likely);
	});
	it('a restricted month breaks the run, so the gardener still sees which feedings may be skipped', () => {
		const restricted = plan('south-florida-coast', '2027-03-15', {
			feeding: { npk: [8, 10, 16], fullRationG: 907.18474, handfulG: 100, restrictedMonths: [7, 8] }
		});
		const runs = feedingRuns(restricted);
		const flagged = runs.filter((r) => r.first.restricted);
		expect(flagged.length).toBeGreaterThan(0);
		for (const r of flagged) for (const m of [r.first.likely, r.last.likely]) expect(['07', '08']).toContain(m.slice(5, 7));
		for (const r of runs.filter((r) => !r.first.restricted)) expect(r.first.likely.slice(5, 7)).not.toBe('07');
	});
});

describe('long plans say why', () => {
	it(`a plan over ${LONG_PLAN_YEARS} years names the cool garden; a tropical one says nothing`, () => {
		expect(years(cool)).toBeGreaterThan(LONG_PLAN_YEARS);
		expect(longPlanNote(cool)).toMatch(/cooler than bananas like/);
		expect(longPlanNote(cool)).toContain(`about ${Math.round(years(cool))} years`);
		expect(years(warm)).toBeLessThanOrEqual(LONG_PLAN_YEARS);
		expect(longPlanNote(warm)).toBeUndefined();
		expect(longPlanNote([])).toBeUndefined();
	});
});
