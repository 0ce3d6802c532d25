/**
 * Plan preview input, shared by the JSON API, the calendar feed and the year planner form.
 * Two spellings of one request: a JSON body (nested climate and observations) and a query
 * string (flat, so a planner URL can be shared, bookmarked and subscribed to).
 */
import { z } from 'zod';
import {
	BOUND_MESSAGES,
	MONTHLY_MEAN_RANGE_TEXT,
	PLAN_BOUNDS,
	coolClimateIssue,
	UNITS,
	dateIssue,
	observedIssues,
	thermalClockFor,
	type IsoDate,
	type Observed,
	type PlanInputIssue,
	type Units
} from '$lib/care';

export const AGE_MAX_WEEKS = PLAN_BOUNDS.ageAtPlantingWeeks.max;
/** Monthly means outside this range are typing slips, not climates a banana could live in. */
export const MEAN_MIN_C = PLAN_BOUNDS.monthlyMeanC.min;
export const MEAN_MAX_C = PLAN_BOUNDS.monthlyMeanC.max;

/** The query-string value that chooses the twelve monthly inputs instead of a catalogue climate. */
export const CUSTOM_CLIMATE = 'custom';

/** A calendar date the engine accepts: the engine's own rule (format, real day, year bounds). */
export const isoDateField = z
	.string({ error: 'Enter a date as YYYY-MM-DD' })
	.trim()
	.superRefine((value, ctx) => {
		const message = dateIssue(value);
		if (message) ctx.addIssue({ code: 'custom', message, abort: true });
	});

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

const ageMessage = BOUND_MESSAGES.ageAtPlantingWeeks;
export const ageField = z
	.number({ error: ageMessage })
	.int(ageMessage)
	.min(PLAN_BOUNDS.ageAtPlantingWeeks.min, ageMessage)
	.max(AGE_MAX_WEEKS, ageMessage);

export const MEAN_RANGE_TEXT = MONTHLY_MEAN_RANGE_TEXT;
const meanMessage = BOUND_MESSAGES.monthlyMeanC;
export const monthlyMeansField = z
	.array(z.number({ error: meanMessage }).min(MEAN_MIN_C, meanMessage).max(MEAN_MAX_C, meanMessage), {
		error: 'Give 12 monthly mean temperatures, January first'
	})
	.length(12, BOUND_MESSAGES.monthlyMeans)
	.superRefine((means, ctx) => {
		// Only a full, in-range year can be judged; the checks above already reported anything else.
		if (means.length !== 12 || !means.every((t) => typeof t === 'number' && t >= MEAN_MIN_C && t <= MEAN_MAX_C)) return;
		const message = coolClimateIssue(thermalClockFor(means).commonYear);
		if (message) ctx.addIssue({ code: 'custom', message });
	});

export const unitsField = z.enum(UNITS, { error: 'Choose metric or imperial' });

/** The request once parsed, whichever spelling it came in. */
export interface PlanRequest {
	cultivar: string;
	plantedOn: IsoDate;
	ageAtPlantingWeeks: number;
	climate: string | { monthlyMeanC: number[] };
	units?: Units;
	observed?: Observed;
	observedFollowers?: Observed[];
}

const leavesMessage = BOUND_MESSAGES.leaves;

/** Milestones logged for one stem (see the engine's Observed); the rules between dates are the engine's. */
export const observedSchema = z
	.object(
		{
			leafCount: z
				.object(
					{ on: isoDateField, leaves: z.number({ error: leavesMessage }).int(leavesMessage).min(PLAN_BOUNDS.leafCount.min, leavesMessage).max(PLAN_BOUNDS.leafCount.max, leavesMessage) },
					{ error: 'A leaf count is an object with on and leaves' }
				)
				.strict()
				.optional(),
			followersOn: isoDateField.optional(),
			flagLeafOn: isoDateField.optional(),
			shotOn: isoDateField.optional(),
			harvestedOn: isoDateField.optional(),
			cutBackOn: isoDateField.optional(),
			stemRemovedOn: isoDateField.optional(),
			lostOn: isoDateField.optional()
		},
		{ error: 'Observed must be an object of logged milestones' }
	)
	.strict() satisfies z.ZodType<Observed>;

/** The engine's rules between logged dates, reported at `pathOf(issue.path)`. */
function addObservedIssues(ctx: z.RefinementCtx, issues: PlanInputIssue[], pathOf: (path: PlanInputIssue['path']) => PlanInputIssue['path'] = (p) => p) {
	for (const issue of issues) ctx.addIssue({ code: 'custom', path: pathOf(issue.path), message: issue.message });
}

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
		observed: observedSchema.optional(),
		observedFollowers: z
			.array(observedSchema, { error: 'observedFollowers must be a list of logged milestones, follower 1 first' })
			.max(PLAN_BOUNDS.generations.max - 1, `Log at most ${PLAN_BOUNDS.generations.max - 1} followers`)
			.optional()
	}, { error: 'The body must be a JSON object' })
	.superRefine((body, ctx) => addObservedIssues(ctx, observedIssues(body.plantedOn, body.observed, body.observedFollowers))) satisfies z.ZodType<PlanRequest>;

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
		// The query string is flat: ["observed", "shotOn"] is reported at "shotOn".
		.superRefine((q, ctx) => addObservedIssues(ctx, observedIssues(q.plantedOn, { shotOn: q.shotOn, harvestedOn: q.harvestedOn }), (p) => p.slice(1)))
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
