/**
 * The calibration harness: runs the engine on every check of anchors.ts and renders the table of
 * docs/calibration.md. Pure and deterministic, so the committed table can be compared with a fresh
 * run (tests/unit/care/calibration.test.ts; `npm run calibrate` rewrites it).
 */
import { computePlan } from '../plan';
import { findCultivar } from '../catalogue/cultivars';
import { parseIsoDate } from '../dates';
import type { Plan, PlanInput, Step, StepKind } from '../types';
import { MEASURE_NAMES, MEASURE_UNIT, checks, type Check, type Measure } from './anchors';
import { station, stations } from './stations';

export const MEAN_MONTH_DAYS = 365.2425 / 12;

/** The engine's answer for one month: its likely value and its window, in the check's unit. */
export interface Sample {
	month: number;
	likely: number;
	earliest: number;
	latest: number;
}

export interface CheckResult {
	check: Check;
	samples: Sample[];
	/** The value compared with the range: the mean of the likely values, or [min, max] of them. */
	low: number;
	high: number;
	inside: boolean;
	/**
	 * Engine over published, midpoint over midpoint (for `covers`: window span over published span;
	 * for `reaches`: the latest window opening over the published upper bound).
	 */
	ratio: number;
}

/** The planting year of every run: a common year, far enough ahead that nothing is clamped. */
const YEAR = 2025;

function on(month: number, year = YEAR): string {
	return `${year}-${String(month).padStart(2, '0')}-15`;
}

function only(plan: Plan, kind: StepKind, generation = 0): Step {
	const found = plan.steps.find((s) => s.kind === kind && s.generation === generation);
	if (!found) throw new Error(`The plan has no ${kind} step for generation ${generation}`);
	return found;
}

function span(from: string, to: string, unit: 'months' | 'days'): number {
	const days = parseIsoDate(to) - parseIsoDate(from);
	return unit === 'days' ? days : days / MEAN_MONTH_DAYS;
}

function planFor(check: Check, plantedOn: string, extra: Partial<PlanInput> = {}): Plan {
	const cultivar = findCultivar(check.cultivar);
	if (!cultivar) throw new Error(`No cultivar ${check.cultivar}`);
	return computePlan({ cultivar, climate: { monthlyMeanC: [...station(check.station).monthlyMeanC] }, plantedOn, ageAtPlantingWeeks: 0, generations: 3, ...extra });
}

const FROM_PLANTING: Partial<Record<Measure, StepKind>> = {
	'planting-to-shooting': 'shooting',
	'planting-to-harvest': 'harvest',
	'planting-to-stem-removal': 'stem-removal',
	'planting-to-followers': 'followers'
};

/** A window measured from a fixed day (planting or a logged flower) to a step. */
function fromDay(day: string, step: Step, unit: 'months' | 'days', month: number): Sample {
	return { month, likely: span(day, step.likely, unit), earliest: span(day, step.earliest, unit), latest: span(day, step.latest, unit) };
}

function samplesFor(check: Check): Sample[] {
	const unit = MEASURE_UNIT[check.measure];
	const target = FROM_PLANTING[check.measure];
	if (target) return check.months.map((m) => fromDay(on(m), only(planFor(check, on(m)), target), unit, m));
	if (check.measure === 'shooting-to-harvest') {
		// A flower logged the year after planting, so only the climate and the flowering month count.
		return check.months.map((m) => {
			const shotOn = on(m, YEAR + 1);
			return fromDay(shotOn, only(planFor(check, on(1), { observed: { shotOn } }), 'harvest'), unit, m);
		});
	}
	// Harvest to next harvest, between likely dates; an interval has no window of its own.
	return check.months.flatMap((m) => {
		const plan = planFor(check, on(m));
		return [0, 1].map((g) => {
			const likely = span(only(plan, 'harvest', g).likely, only(plan, 'harvest', g + 1).likely, unit);
			return { month: m, likely, earliest: Number.NaN, latest: Number.NaN };
		});
	});
}

export function runCheck(check: Check): CheckResult {
	const samples = samplesFor(check);
	const values = samples.map((s) => s.likely);
	const [from, to] = check.range;
	if (check.statistic === 'reaches') {
		// The latest-opening and the earliest-closing windows are the ones that could miss the range.
		const low = Math.max(...samples.map((s) => s.earliest));
		const high = Math.min(...samples.map((s) => s.latest));
		const inside = samples.every((s) => s.earliest <= to && s.latest >= from);
		return { check, samples, low, high, inside, ratio: low / to };
	}
	if (check.statistic === 'covers') {
		const low = Math.min(...samples.map((s) => s.earliest));
		const high = Math.max(...samples.map((s) => s.latest));
		return { check, samples, low, high, inside: low <= from && high >= to, ratio: (high - low) / (to - from) };
	}
	const [low, high] = check.statistic === 'mean' ? Array(2).fill(values.reduce((a, b) => a + b, 0) / values.length) : [Math.min(...values), Math.max(...values)];
	return { check, samples, low, high, inside: low >= from && high <= to, ratio: (low + high) / (from + to) };
}

export function runCalibration(): CheckResult[] {
	return checks.map(runCheck);
}

function fixed(x: number, unit: 'months' | 'days'): string {
	return unit === 'days' ? x.toFixed(0) : x.toFixed(1);
}

function between(a: number, b: number, unit: 'months' | 'days'): string {
	const [x, y] = [fixed(a, unit), fixed(b, unit)];
	return x === y ? x : `${x}–${y}`;
}

const STATISTIC_PREFIX: Readonly<Record<Check['statistic'], string>> = { each: '', mean: 'mean of ', covers: 'windows of ', reaches: 'windows of ' };

const MONTH_ABBR = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

function monthsText(months: readonly number[]): string {
	return months.length === 12 ? 'every month' : months.map((m) => MONTH_ABBR[m - 1]).join(', ');
}

/** The markdown table of every check, the block docs/calibration.md holds between its markers. */
export function calibrationTable(results: CheckResult[] = runCalibration()): string {
	const rows = results.map((r) => {
		const c = r.check;
		const unit = MEASURE_UNIT[c.measure];
		const earliest = Math.min(...r.samples.map((s) => s.earliest));
		const latest = Math.max(...r.samples.map((s) => s.latest));
		const window = Number.isNaN(earliest) ? '—' : between(earliest, latest, unit);
		const opening = between(Math.min(...r.samples.map((s) => s.earliest)), r.low, unit);
		const engine = c.statistic === 'covers' ? `windows span ${between(r.low, r.high, unit)}` : c.statistic === 'reaches' ? `windows open at ${opening}` : c.statistic === 'mean' ? `mean ${fixed(r.low, unit)} (${between(Math.min(...r.samples.map((s) => s.likely)), Math.max(...r.samples.map((s) => s.likely)), unit)})` : between(r.low, r.high, unit);
		const verdict = r.inside ? 'inside' : c.outsideBecause ? 'other reading, not met (see below)' : '**outside**';
		return `| ${c.place} | ${c.cultivar} | ${MEASURE_NAMES[c.measure]}, ${STATISTIC_PREFIX[c.statistic]}${monthsText(c.months)} | ${c.figure} | ${c.source} | ${between(c.range[0], c.range[1], unit)} ${unit} (${c.rangeNote}) | ${engine} ${unit} | ${window} | ${r.ratio.toFixed(2)} | ${verdict} |`;
	});
	return [
		'| place | cultivar | engine measure, months of planting or flowering | published figure | source | range checked | engine, likely | engine, window | ratio | result |',
		'| --- | --- | --- | --- | --- | --- | --- | --- | --- | --- |',
		...rows
	].join('\n');
}

/** The stations' normals, as the engine reads them. */
export function stationsTable(): string {
	const rows = stations.map((s) => `| ${s.name} | ${s.normal} | ${s.monthlyMeanC.map((t) => t.toFixed(1)).join(' · ')} | ${(s.monthlyMeanC.reduce((a, b) => a + b, 0) / 12).toFixed(1)} | ${s.fromMemory ? 'from memory' : 'published'}${s.checkedAgainst ? `; checked against ${s.checkedAgainst}` : ''} |`);
	return ['| station | normal | monthly means Jan–Dec, °C | annual | provenance |', '| --- | --- | --- | ---: | --- |', ...rows].join('\n');
}

/** The whole generated block: the checks, then the stations. */
export function calibrationBlock(results: CheckResult[] = runCalibration()): string {
	return `${calibrationTable(results)}\n\nStations:\n\n${stationsTable()}`;
}

/**
 * Results that break the calibration: outside without a known reason, a known miss now inside, or
 * a known miss whose figure is not met on its other reading either.
 */
export function calibrationFailures(results: CheckResult[] = runCalibration()): string[] {
	const inside = new Map(results.map((r) => [r.check.id, r.inside]));
	return results.flatMap((r) => {
		if (!r.inside && !r.check.outsideBecause) return [`${r.check.id}: ${r.low.toFixed(1)}–${r.high.toFixed(1)} is outside ${r.check.range.join('–')}`];
		if (r.inside && r.check.outsideBecause) return [`${r.check.id}: now inside; drop its outsideBecause and update docs/calibration.md`];
		if (r.check.outsideBecause && inside.get(r.check.otherReadingOf ?? '') !== true) return [`${r.check.id}: a known miss must be another reading of a figure that is met (otherReadingOf)`];
		return [];
	});
}

/** Published figures (a figure read two ways counts once) and how many are met on some reading. */
export function figuresMet(results: CheckResult[] = runCalibration()): { figures: number; met: number } {
	const primary = results.filter((r) => !r.check.otherReadingOf);
	return { figures: primary.length, met: primary.filter((r) => r.inside).length };
}

export const TABLE_START = '<!-- calibrate:table:start (generated by npm run calibrate; do not edit by hand) -->';
export const TABLE_END = '<!-- calibrate:table:end -->';

/** `doc` with the block between the markers replaced by `table`. */
export function withTable(doc: string, table: string): string {
	const start = doc.indexOf(TABLE_START);
	const end = doc.indexOf(TABLE_END);
	if (start < 0 || end < start) throw new Error('docs/calibration.md lacks the table markers');
	return `${doc.slice(0, start + TABLE_START.length)}\n${table}\n${doc.slice(end)}`;
}

