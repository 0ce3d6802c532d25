/**
 * Layout of the plan timeline (PlanTimeline.svelte): lanes per generation, bars per step, month
 * ticks and their labels, in drawing units of a fixed-width SVG viewBox. Pure, so the rules (no
 * two marks touching, every label inside the chart) are tested without a browser.
 */
import { addMonths, formatIsoDate, parseIsoDate, type IsoDate, type Step } from '$lib/care';
import { formatMonth, stepColour } from '$lib/plan-text';

export const CHART = {
	width: 1000,
	labelWidth: 118,
	rightPad: 12,
	top: 22,
	rowHeight: 15,
	lanePad: 7,
	axisHeight: 34,
	/** Steps closer than this in drawing units go on separate rows, so marks never touch. */
	minGap: 6,
	/** Axis label font size, drawing units; labels are estimated at `charWidth` × font size per character. */
	axisFont: 11,
	charWidth: 0.62,
	/** A label starts this far right of its tick. */
	labelOffset: 3
} as const;

export interface Bar {
	step: Step;
	x0: number;
	x1: number;
	xLikely: number;
	row: number;
	colour: string;
}

export interface Lane {
	generation: number;
	y: number;
	height: number;
	bars: Bar[];
	shaded: boolean;
}

export interface AxisLabel {
	text: string;
	x: number;
	/** Estimated width in drawing units, for keeping it inside the chart. */
	width: number;
	bold: boolean;
	line: 1 | 2;
}

export interface TimelineLayout {
	lanes: Lane[];
	ticks: { x: number; major: boolean }[];
	labels: AxisLabel[];
	plotBottom: number;
	height: number;
	todayX: number | null;
	/** Centre of the "Today" label: over the line, moved in where the line is near an edge. */
	todayLabelX: number | null;
	from: string;
	to: string;
}

export const TODAY_LABEL = 'Today';
export const TODAY_FONT = 12;

const isRoutine = (s: Step) => s.kind === 'feeding' || s.kind === 'planting';

export function labelWidth(text: string, font: number = CHART.axisFont): number {
	return text.length * font * CHART.charWidth;
}

/** A label's left edge: beside its tick, pulled back so its right end stays inside the chart. */
export function labelX(tickX: number, width: number): number {
	return Math.min(tickX + CHART.labelOffset, CHART.width - CHART.rightPad - width);
}

export function timelineLayout(steps: Step[], today?: IsoDate): TimelineLayout {
	const c = CHART;
	const first = Math.min(...steps.map((s) => parseIsoDate(s.earliest)));
	const last = Math.max(...steps.map((s) => parseIsoDate(s.latest)));
	// Whole months either side, so the axis starts and ends on a tick.
	const startIso = formatIsoDate(first).slice(0, 8) + '01';
	const start = parseIsoDate(startIso);
	const end = addMonths(parseIsoDate(formatIsoDate(last).slice(0, 8) + '01'), 1);
	const x = (day: number) => c.labelWidth + ((day - start) / (end - start)) * (c.width - c.labelWidth - c.rightPad);

	const generations = [...new Set(steps.map((s) => s.generation))].sort((a, b) => a - b);
	let y = c.top;
	const lanes = generations.map((generation, laneIndex) => {
		// Greedy row packing keeps overlapping windows of one generation readable.
		const rowEnds: number[] = [];
		const bars = steps
			.filter((s) => s.generation === generation)
			// Mat-wide routine (planting, feedings) goes first so it fills one tidy row of its own.
			.sort((a, b) => Number(isRoutine(b)) - Number(isRoutine(a)) || a.earliest.localeCompare(b.earliest))
			.map((step) => {
				const x0 = x(parseIsoDate(step.earliest));
				const x1 = Math.max(x(parseIsoDate(step.latest) + 1), x0 + 4);
				let row = rowEnds.findIndex((endX) => endX + c.minGap <= x0);
				if (row === -1) row = rowEnds.push(x1) - 1;
				else rowEnds[row] = x1;
				return { step, x0, x1, xLikely: x(parseIsoDate(step.likely) + 0.5), row, colour: stepColour(step) };
			});
		const height = Math.max(1, rowEnds.length) * c.rowHeight + c.lanePad * 2;
		const lane = { generation, y, height, bars, shaded: laneIndex % 2 === 0 };
		y += height;
		return lane;
	});

	const months: { x: number; iso: string }[] = [];
	for (let m = start; m <= end; m = addMonths(m, 1)) months.push({ x: x(m), iso: formatIsoDate(m) });
	const monthWidth = (c.width - c.labelWidth - c.rightPad) / Math.max(1, months.length - 1);
	const labelEvery = monthWidth >= 26 ? 1 : monthWidth >= 13 ? 2 : 3;
	const ticks: TimelineLayout['ticks'] = [];
	const labels: AxisLabel[] = [];
	// The last tick closes the axis; it labels nothing.
	months.forEach((m, i) => {
		const january = m.iso.slice(5, 7) === '01';
		// The first month carries its year too, unless January's label follows too closely.
		const year = january || (i === 0 && Number(m.iso.slice(5, 7)) <= 10) ? m.iso.slice(0, 4) : null;
		ticks.push({ x: m.x, major: year !== null });
		if (i === months.length - 1) return;
		if (i % labelEvery === 0) {
			const text = formatMonth(m.iso).slice(0, 3);
			const width = labelWidth(text);
			labels.push({ text, x: labelX(m.x, width), width, bold: false, line: 1 });
		}
		if (year) {
			const width = labelWidth(year);
			labels.push({ text: year, x: labelX(m.x, width), width, bold: true, line: 2 });
		}
	});
	const todayDay = today ? parseIsoDate(today) : NaN;
	const todayX = todayDay >= start && todayDay <= end ? x(todayDay + 0.5) : null;
	const todayHalf = labelWidth(TODAY_LABEL, TODAY_FONT) / 2;
	return {
		lanes,
		ticks,
		labels,
		plotBottom: y,
		height: y + c.axisHeight,
		todayX,
		todayLabelX: todayX === null ? null : Math.min(Math.max(todayX, todayHalf), c.width - todayHalf),
		from: formatMonth(startIso),
		to: formatMonth(formatIsoDate(last))
	};
}
