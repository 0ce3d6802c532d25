/**
 * Plan preview: a parsed request (see $lib/schema/plan) → the engine's PlanInput → a plan,
 * with the cultivar, climate and the nursery's fertilizer and local rules taken from a catalogue
 * snapshot (`catalogueService.snapshot()`). Nothing is stored: previews are for anyone.
 */
import { createHash } from 'node:crypto';
import { PlanInputError, computePlan, type Cultivar, type Plan, type PlanInput } from '$lib/care';
import { CUSTOM_CLIMATE, planQuerySchema, planQueryString, queryValues, splitMeanValues, type PlanRequest, type QueryValues } from '$lib/schema/plan';
import { fieldErrors, type FieldErrors } from '$lib/schema/form';
import { formatDay } from '$lib/plan-text';
import { byteCache } from './byte-cache';
import { planCalendar, type CalendarFile } from './calendar';
import { UserFacingError } from './errors';
import { defaultClimateSlug, defaultCultivarSlug, type CatalogueSnapshot } from './catalogue/snapshot';

export interface PlanPreview {
	request: PlanRequest;
	cultivar: Cultivar;
	/** Human name of the climate: the profile's, or "your monthly means". */
	climateName: string;
	plan: Plan;
}

/**
 * Retired cultivars are still found: a calendar subscribed before the nursery stopped selling one
 * keeps working. The schema checks only the shape of a slug; whether it exists is known here.
 */
export function toPlanInput(request: PlanRequest, catalogue: CatalogueSnapshot): PlanInput {
	const cultivar = catalogue.cultivar(request.cultivar)?.cultivar;
	if (!cultivar) throw new UserFacingError('cultivar', 'Unknown cultivar: choose one listed by GET /api/v1/cultivars');
	let monthlyMeanC: number[];
	if (typeof request.climate === 'string') {
		const profile = catalogue.climate(request.climate);
		if (!profile) throw new UserFacingError('climate', 'Unknown climate: choose one listed by GET /api/v1/climates, or give 12 monthly means');
		monthlyMeanC = profile.climate.monthlyMeanC;
	} else monthlyMeanC = request.climate.monthlyMeanC;
	return {
		cultivar,
		plantedOn: request.plantedOn,
		ageAtPlantingWeeks: request.ageAtPlantingWeeks,
		climate: { monthlyMeanC },
		units: request.units ?? 'metric',
		feeding: catalogue.feeding,
		...(request.observed ? { observed: request.observed } : {}),
		...(request.observedFollowers ? { observedFollowers: request.observedFollowers } : {})
	};
}

export function previewPlan(request: PlanRequest, catalogue: CatalogueSnapshot): PlanPreview {
	const input = toPlanInput(request, catalogue);
	const climateName = typeof request.climate === 'string' ? (catalogue.climate(request.climate)?.climate.name ?? request.climate) : 'your monthly means';
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
export function previewCalendar(request: PlanRequest, catalogue: CatalogueSnapshot, origin?: string): CalendarFile {
	// The engine's whole input (cultivar parameters, climate, fertilizer…) is the key: an owner's edit to a cultivar makes a new calendar.
	const key = createHash('sha256').update(JSON.stringify([toPlanInput(request, catalogue), origin ?? null])).digest('base64url');
	const ics = calendarCache.through(key, () => {
		const { cultivar, plan } = previewPlan(request, catalogue);
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

/** What the planner shows before anyone has chosen: a plant of the reference cultivar, bought today, in the nursery's climate and units. */
export function exampleRequest(today: string, catalogue: CatalogueSnapshot): PlanRequest {
	return {
		cultivar: defaultCultivarSlug(catalogue) ?? '',
		plantedOn: today,
		ageAtPlantingWeeks: 12,
		climate: defaultClimateSlug(catalogue),
		units: catalogue.settings.units
	};
}

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
	/** `nurserys`: the nursery's own profile, listed first. */
	climateOptions: { slug: string; name: string; nurserys: boolean }[];
}

function formValues(raw: QueryValues, catalogue: CatalogueSnapshot): PlannerValues {
	const means = splitMeanValues(raw.monthlyMeanC ?? []).map((v) => v.trim());
	const climate = raw.climate ?? (means.length > 0 ? CUSTOM_CLIMATE : '');
	// Switching to "my own means" starts from the chosen profile rather than twelve blanks.
	const base = catalogue.climate(climate)?.climate.monthlyMeanC.map(String) ?? [];
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

/** Engine refusals keyed like the form's fields (the query string is flat: `shotOn`, `monthlyMeanC.3`). */
function planInputFieldErrors(error: PlanInputError): FieldErrors {
	const out: FieldErrors = {};
	for (const issue of error.issues) {
		const path = issue.path[0] === 'observed' || issue.path[0] === 'climate' ? issue.path.slice(1) : issue.path;
		out[path.join('.') || 'form'] ??= issue.message;
	}
	return out;
}

/** Offered cultivars; a retired one only when a shared link asks for it, so the form shows what the plan is for. */
function cultivarOptions(catalogue: CatalogueSnapshot, asked: string | undefined) {
	const retired = asked ? catalogue.cultivar(asked.trim()) : undefined;
	const options = catalogue.offeredCultivars.map(({ cultivar: { slug, name } }) => ({ slug, name }));
	if (retired?.retired) options.push({ slug: retired.cultivar.slug, name: `${retired.cultivar.name} (no longer sold)` });
	return options;
}

/**
 * The year planner page: the query string is the form, so every plan has a shareable URL.
 * Retired cultivars are not offered, but a shared link to one still shows its plan.
 */
export function plannerView(params: URLSearchParams, catalogue: CatalogueSnapshot, today = todayIso(new Date(), catalogue.settings.timeZone)): PlannerView {
	const asked = queryValues(params);
	const example = Object.keys(asked).length === 0;
	const raw = example ? queryValues(new URLSearchParams(planQueryString(exampleRequest(today, catalogue)))) : asked;
	const parsed = planQuerySchema.safeParse(raw);
	const base = {
		today,
		values: formValues(raw, catalogue),
		example,
		cultivarOptions: cultivarOptions(catalogue, raw.cultivar),
		climateOptions: catalogue.climates.map(({ climate: { slug, name }, nurserys }) => ({ slug, name, nurserys }))
	};
	if (!parsed.success) return { ...base, errors: fieldErrors(parsed.error), result: null };
	let preview: PlanPreview;
	try {
		preview = previewPlan(parsed.data, catalogue);
	} catch (e) {
		if (e instanceof UserFacingError) return { ...base, errors: { [e.field]: e.message }, result: null };
		// The schema asks what the engine asks, so this is a safety net: a refusal is a field error, not a 500.
		if (e instanceof PlanInputError) return { ...base, errors: planInputFieldErrors(e), result: null };
		throw e;
	}
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
