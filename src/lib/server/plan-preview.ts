/**
 * Plan preview: a parsed request (see $lib/schema/plan) → the engine's PlanInput → a plan,
 * fed with the nursery's fertilizer and local rules (the routes read them from the settings;
 * without them, the engine's `defaultFeeding`). Nothing is stored: previews are for anyone.
 */
import {
	climates,
	computePlan,
	cultivars,
	defaultFeeding,
	findClimate,
	findCultivar,
	referenceClimateSlug,
	type Cultivar,
	type FeedingSettings,
	type Plan,
	type PlanInput
} from '$lib/care';
import { CUSTOM_CLIMATE, planQuerySchema, planQueryString, queryValues, splitMeanValues, type PlanRequest, type QueryValues } from '$lib/schema/plan';
import { fieldErrors, type FieldErrors } from '$lib/schema/form';
import { formatDay } from '$lib/plan-text';
import { byteCache } from './byte-cache';
import { planCalendar, type CalendarFile } from './calendar';
import { UserFacingError } from './errors';

export interface PlanPreview {
	request: PlanRequest;
	cultivar: Cultivar;
	/** Human name of the climate: the profile's, or "your monthly means". */
	climateName: string;
	plan: Plan;
}

export function toPlanInput(request: PlanRequest, feeding: FeedingSettings = defaultFeeding): PlanInput {
	const cultivar = findCultivar(request.cultivar);
	if (!cultivar) throw new UserFacingError('cultivar', 'Unknown cultivar');
	let monthlyMeanC: number[];
	if (typeof request.climate === 'string') {
		const profile = findClimate(request.climate);
		if (!profile) throw new UserFacingError('climate', 'Unknown climate');
		monthlyMeanC = profile.monthlyMeanC;
	} else monthlyMeanC = request.climate.monthlyMeanC;
	return {
		cultivar,
		plantedOn: request.plantedOn,
		ageAtPlantingWeeks: request.ageAtPlantingWeeks,
		climate: { monthlyMeanC },
		units: request.units ?? 'metric',
		feeding,
		...(request.observed ? { observed: request.observed } : {})
	};
}

export function previewPlan(request: PlanRequest, feeding?: FeedingSettings): PlanPreview {
	const input = toPlanInput(request, feeding);
	const climateName = typeof request.climate === 'string' ? (findClimate(request.climate)?.name ?? request.climate) : 'your monthly means';
	return { request, cultivar: input.cultivar, climateName, plan: computePlan(input) };
}

/**
 * Calendars already written, keyed by everything that goes into one. Writing the iCalendar text
 * costs tens of milliseconds (the plan itself about one), so a public URL fetched again, by a
 * subscribed calendar or by someone hammering it, is served from here. 32 MiB holds thousands.
 */
export const calendarCache = byteCache(32 * 1024 * 1024);

/**
 * The preview as a calendar. Its identity is the plant (cultivar and planting day), not the
 * climate or logged milestones, so refining those later updates the same events.
 */
export function previewCalendar(request: PlanRequest, origin?: string, feeding: FeedingSettings = defaultFeeding): CalendarFile {
	const key = JSON.stringify([planQueryString(request), feeding, origin ?? null]);
	const ics = calendarCache.through(key, () => {
		const { cultivar, plan } = previewPlan(request, feeding);
		return planCalendar(plan, {
			identity: `preview|${request.cultivar}|${request.plantedOn}`,
			name: `${cultivar.name} planted ${formatDay(request.plantedOn)} · Bunchline`,
			...(origin ? { origin } : {})
		});
	});
	return { filename: `bunchline-${request.cultivar}-${request.plantedOn}.ics`, ics };
}

/** Today in the nursery's time zone (IANA name), as the planner's default planting date and "today" line. */
export function todayIso(now: Date = new Date(), timeZone = 'UTC'): string {
	// en-CA formats dates as YYYY-MM-DD.
	return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
}

/** What the planner shows before anyone has chosen: a plant of the first cultivar, bought today. */
export function exampleRequest(today: string): PlanRequest {
	return { cultivar: cultivars[0].slug, plantedOn: today, ageAtPlantingWeeks: 12, climate: referenceClimateSlug, units: 'metric' };
}

export const catalogue = { cultivars, climates };

/** What the planner form shows in its inputs: always strings, always twelve months. */
export interface PlannerValues {
	cultivar: string;
	plantedOn: string;
	ageAtPlantingWeeks: string;
	climate: string;
	monthlyMeanC: string[];
	units: string;
	shotOn: string;
	harvestedOn: string;
}

export interface PlannerView {
	today: string;
	values: PlannerValues;
	errors: FieldErrors;
	/** True when nothing was asked yet and an example plan is shown. */
	example: boolean;
	result: null | {
		cultivarName: string;
		climateName: string;
		plantedOn: string;
		plan: Plan;
		/** Canonical query of the request, for the calendar links and sharing. */
		query: string;
	};
	cultivarOptions: { slug: string; name: string }[];
	climateOptions: { slug: string; name: string }[];
}

function formValues(raw: QueryValues): PlannerValues {
	const means = splitMeanValues(raw.monthlyMeanC ?? []).map((v) => v.trim());
	const climate = raw.climate ?? (means.length > 0 ? CUSTOM_CLIMATE : '');
	// Switching to "my own means" starts from the chosen profile rather than twelve blanks.
	const base = findClimate(climate)?.monthlyMeanC.map(String) ?? [];
	return {
		cultivar: raw.cultivar ?? '',
		plantedOn: raw.plantedOn ?? '',
		ageAtPlantingWeeks: raw.ageAtPlantingWeeks ?? '',
		climate,
		monthlyMeanC: Array.from({ length: 12 }, (_, i) => means[i] ?? base[i] ?? ''),
		units: raw.units ?? 'metric',
		shotOn: raw.shotOn ?? '',
		harvestedOn: raw.harvestedOn ?? ''
	};
}

/** The year planner page: the query string is the form, so every plan has a shareable URL. */
export function plannerView(params: URLSearchParams, today = todayIso(), feeding?: FeedingSettings): PlannerView {
	const asked = queryValues(params);
	const example = Object.keys(asked).length === 0;
	const raw = example ? queryValues(new URLSearchParams(planQueryString(exampleRequest(today)))) : asked;
	const parsed = planQuerySchema.safeParse(raw);
	const base = {
		today,
		values: formValues(raw),
		example,
		cultivarOptions: cultivars.map(({ slug, name }) => ({ slug, name })),
		climateOptions: climates.map(({ slug, name }) => ({ slug, name }))
	};
	if (!parsed.success) return { ...base, errors: fieldErrors(parsed.error), result: null };
	const preview = previewPlan(parsed.data, feeding);
	return {
		...base,
		errors: {},
		result: {
			cultivarName: preview.cultivar.name,
			climateName: preview.climateName,
			plantedOn: parsed.data.plantedOn,
			plan: preview.plan,
			query: planQueryString(parsed.data)
		}
	};
}
