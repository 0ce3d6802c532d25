/**
 * Plan preview input, shared by the JSON API, the calendar feed and the year planner form.
 * Two spellings of one request: a JSON body (nested climate and observations) and a query
 * string (flat, so a planner URL can be shared, bookmarked and subscribed to).
 */
import { z } from 'zod';
import { model, parseIsoDate, thermalClockFor, type IsoDate, type Units } from '$lib/care';

export const AGE_MAX_WEEKS = 104;
/** Monthly means outside this range are typing slips, not climates a banana could live in. */
export const MEAN_MIN_C = -30;
export const MEAN_MAX_C = 50;
/** Years outside this range are typing slips too (e.g. 0226), and would make plans run off the calendar. */
const YEAR_MIN = 1900;
const YEAR_MAX = 2200;

/** The query-string value that chooses the twelve monthly inputs instead of a catalogue climate. */
export const CUSTOM_CLIMATE = 'custom';

function isCalendarDate(value: string): boolean {
	try {
		parseIsoDate(value);
		return true;
	} catch {
		return false;
	}
}

export const isoDateField = z
	.string({ error: 'Enter a date as YYYY-MM-DD' })
	.trim()
	.regex(/^\d{4}-\d{2}-\d{2}$/, { error: 'Enter a date as YYYY-MM-DD', abort: true })
	.refine(isCalendarDate, { error: 'No such date on the calendar', abort: true })
	.refine((d) => {
		const year = Number(d.slice(0, 4));
		return year >= YEAR_MIN && year <= YEAR_MAX;
	}, `Enter a year between ${YEAR_MIN} and ${YEAR_MAX}`);

/**
 * Catalogue slugs: lowercase words joined by hyphens. Whether one exists is known only to the
 * catalogue in the database, so the plan service checks that (an unknown slug is a 400 there).
 */
export const SLUG_MAX = 80;
export const SLUG_PATTERN = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

function slugField(choose: string, unknown: string) {
	return z
		.string({ error: choose })
		.trim()
		.min(1, { error: choose, abort: true })
		.max(SLUG_MAX, { error: unknown, abort: true })
		.regex(SLUG_PATTERN, unknown);
}

export const cultivarField = slugField('Choose a cultivar', 'Unknown cultivar: choose one listed by GET /api/v1/cultivars');

export const climateSlugField = slugField('Choose a climate', 'Unknown climate: choose one listed by GET /api/v1/climates, or give 12 monthly means');

const ageMessage = `Enter a whole number of weeks from 0 to ${AGE_MAX_WEEKS}`;
export const ageField = z
	.number({ error: ageMessage })
	.int(ageMessage)
	.min(0, ageMessage)
	.max(AGE_MAX_WEEKS, ageMessage);

/** A true minus sign reads better than a hyphen, and screen readers say "minus". */
export const MEAN_RANGE_TEXT = `${String(MEAN_MIN_C).replace('-', '−')} to ${MEAN_MAX_C} °C`;
const meanMessage = `Enter a temperature from ${MEAN_RANGE_TEXT}`;
export const monthlyMeansField = z
	.array(z.number({ error: meanMessage }).min(MEAN_MIN_C, meanMessage).max(MEAN_MAX_C, meanMessage), {
		error: 'Give 12 monthly mean temperatures, January first'
	})
	.length(12, 'Give exactly 12 monthly mean temperatures, January first')
	.superRefine((means, ctx) => {
		// Only a full, in-range year can be judged; the checks above already reported anything else.
		if (means.length !== 12 || !means.every((t) => typeof t === 'number' && t >= MEAN_MIN_C && t <= MEAN_MAX_C)) return;
		const perYear = thermalClockFor(means).commonYear;
		if (perYear < model.MIN_ANNUAL_DEGREE_DAYS) {
			ctx.addIssue({
				code: 'custom',
				message: `Too cool for a banana to fruit: these means give about ${Math.round(perYear)} °C·d a year, and at least ${model.MIN_ANNUAL_DEGREE_DAYS} are needed`
			});
		}
	});

export const unitsField = z.enum(['metric', 'imperial'], { error: 'Choose metric or imperial' });

/** The request once parsed, whichever spelling it came in. */
export interface PlanRequest {
	cultivar: string;
	plantedOn: IsoDate;
	ageAtPlantingWeeks: number;
	climate: string | { monthlyMeanC: number[] };
	units?: Units;
	observed?: { shotOn?: IsoDate; harvestedOn?: IsoDate };
}

type ObservedField = 'shotOn' | 'harvestedOn';

/**
 * The one rule for logged milestones: nothing happens before planting, and a stem is
 * harvested only after it has shot. ISO dates compare correctly as strings.
 */
function observationIssues(plantedOn: IsoDate, observed: PlanRequest['observed']): { field: ObservedField; message: string }[] {
	const issues: { field: ObservedField; message: string }[] = [];
	const { shotOn, harvestedOn } = observed ?? {};
	if (shotOn && shotOn < plantedOn) issues.push({ field: 'shotOn', message: 'Shooting cannot come before planting' });
	if (harvestedOn && harvestedOn < plantedOn) issues.push({ field: 'harvestedOn', message: 'Harvest cannot come before planting' });
	else if (harvestedOn && shotOn && harvestedOn < shotOn) issues.push({ field: 'harvestedOn', message: 'Harvest cannot come before shooting' });
	// A mother plant's whole life is well under this; later dates are typing errors, and would make a plan centuries long.
	const latest = addYears(plantedOn, OBSERVED_WITHIN_YEARS);
	for (const field of ['shotOn', 'harvestedOn'] as const) {
		const day = observed?.[field];
		if (day && day > latest) issues.push({ field, message: `Give a date within ${OBSERVED_WITHIN_YEARS} years of planting` });
	}
	return issues;
}

const OBSERVED_WITHIN_YEARS = 5;

function addYears(iso: IsoDate, years: number): IsoDate {
	return `${String(Number(iso.slice(0, 4)) + years).padStart(4, '0')}${iso.slice(4)}`;
}

const observedBody = z
	.object({ shotOn: isoDateField.optional(), harvestedOn: isoDateField.optional() }, { error: 'Observed must be an object with shotOn and/or harvestedOn' })
	.strict();

/** POST /api/v1/plan-preview body. */
export const planBodySchema = z
	.object({
		cultivar: cultivarField,
		plantedOn: isoDateField,
		ageAtPlantingWeeks: ageField,
		climate: z.union([climateSlugField, z.object({ monthlyMeanC: monthlyMeansField })], {
			error: 'Give a climate slug or an object with 12 monthlyMeanC values'
		}),
		units: unitsField.optional(),
		observed: observedBody.optional()
	}, { error: 'The body must be a JSON object' })
	.superRefine((body, ctx) => {
		for (const issue of observationIssues(body.plantedOn, body.observed)) {
			ctx.addIssue({ code: 'custom', path: ['observed', issue.field], message: issue.message });
		}
	}) satisfies z.ZodType<PlanRequest>;

/** Empty query values mean "not given", so blank form inputs read as missing rather than as 0. */
function blank(value: string | undefined): string | undefined {
	return value === undefined || value.trim() === '' ? undefined : value.trim();
}

function numberOrRaw(value: string | undefined): number | string | undefined {
	const v = blank(value);
	return v === undefined || Number.isNaN(Number(v)) ? v : Number(v);
}

/**
 * Twelve separate form inputs and one comma-separated value are both accepted: the planner
 * form without JavaScript sends the first, shared links and the API use the second.
 */
export function splitMeanValues(values: string[]): string[] {
	return values.length === 1 ? values[0].split(',') : values;
}

/**
 * Query values → typed candidates. A catalogue climate wins over monthly means, because the
 * planner form always sends its twelve inputs, filled or not.
 */
function fromQuery(raw: unknown): unknown {
	const q = raw as QueryValues;
	const chosenCustom = q.climate?.trim() === CUSTOM_CLIMATE;
	const custom = q.climate === undefined || chosenCustom;
	const typed = custom && q.monthlyMeanC?.some((v) => v.trim() !== '') ? splitMeanValues(q.monthlyMeanC).map(numberOrRaw) : undefined;
	// "My own means" picked with none typed is reported beside the months, not the climate choice.
	const means = typed ?? (chosenCustom ? [] : undefined);
	return {
		cultivar: blank(q.cultivar),
		plantedOn: blank(q.plantedOn),
		ageAtPlantingWeeks: numberOrRaw(q.ageAtPlantingWeeks),
		// Neither a climate nor any means: reported once, beside the climate choice.
		climate: custom ? (means ? undefined : '') : q.climate,
		monthlyMeanC: means,
		units: blank(q.units),
		shotOn: blank(q.shotOn),
		harvestedOn: blank(q.harvestedOn)
	};
}

/** The query string, read into plain values first: see `queryValues`. Issue paths are query keys. */
export const planQuerySchema = z.preprocess(
	fromQuery,
	z
		.object({
			cultivar: cultivarField,
			plantedOn: isoDateField,
			ageAtPlantingWeeks: ageField,
			climate: climateSlugField.optional(),
			monthlyMeanC: monthlyMeansField.optional(),
			units: unitsField.optional(),
			shotOn: isoDateField.optional(),
			harvestedOn: isoDateField.optional()
		})
		.superRefine((q, ctx) => {
			for (const issue of observationIssues(q.plantedOn, q)) {
				ctx.addIssue({ code: 'custom', path: [issue.field], message: issue.message });
			}
		})
		.transform(
			(q): PlanRequest => ({
				cultivar: q.cultivar,
				plantedOn: q.plantedOn,
				ageAtPlantingWeeks: q.ageAtPlantingWeeks,
				climate: q.climate ?? { monthlyMeanC: q.monthlyMeanC ?? [] },
				...(q.units ? { units: q.units } : {}),
				...(q.shotOn || q.harvestedOn
					? { observed: { ...(q.shotOn ? { shotOn: q.shotOn } : {}), ...(q.harvestedOn ? { harvestedOn: q.harvestedOn } : {}) } }
					: {})
			})
		)
);

const SINGLE_KEYS = ['cultivar', 'plantedOn', 'ageAtPlantingWeeks', 'climate', 'units', 'shotOn', 'harvestedOn'] as const;
export type PlanQueryKey = (typeof SINGLE_KEYS)[number];
export type QueryValues = Partial<Record<PlanQueryKey, string>> & { monthlyMeanC?: string[] };

/** The query string as plain values: first value per key, every monthlyMeanC value. */
export function queryValues(params: URLSearchParams): QueryValues {
	const out: QueryValues = {};
	for (const key of SINGLE_KEYS) {
		const value = params.get(key);
		if (value !== null) out[key] = value;
	}
	const means = params.getAll('monthlyMeanC');
	if (means.length > 0) out.monthlyMeanC = means;
	return out;
}

export function parsePlanQuery(params: URLSearchParams) {
	return planQuerySchema.safeParse(queryValues(params));
}

/** The canonical, shortest query for a request: what the calendar links and shared URLs carry. */
export function planQueryString(request: PlanRequest): string {
	const params = new URLSearchParams({
		cultivar: request.cultivar,
		plantedOn: request.plantedOn,
		ageAtPlantingWeeks: String(request.ageAtPlantingWeeks)
	});
	if (typeof request.climate === 'string') params.set('climate', request.climate);
	else params.set('monthlyMeanC', request.climate.monthlyMeanC.join(','));
	if (request.units) params.set('units', request.units);
	if (request.observed?.shotOn) params.set('shotOn', request.observed.shotOn);
	if (request.observed?.harvestedOn) params.set('harvestedOn', request.observed.harvestedOn);
	return params.toString();
}
