/**
 * The owner's catalogue and settings forms, shared by the browser and the server. Every bound
 * comes from the engine (CULTIVAR_PARAMETER_BOUNDS, FEEDING_SETTING_BOUNDS, the monthly means of
 * the plan input); nothing here invents a limit of its own except the lengths of free text.
 */
import { z } from 'zod';
import {
	CULTIVAR_GROUPS,
	CULTIVAR_PARAMETER_BOUNDS,
	CULTIVAR_PARAMETER_NAMES,
	FEEDING_SETTING_BOUNDS,
	SIZE_CLASSES,
	type CultivarParameterName,
	type ParameterBound
} from '$lib/care';
import { climateSlugField, monthlyMeansField, unitsField } from './plan';

export const TEXT_LIMITS = { name: 80, subgroup: 60, notes: 1000, sourceNote: 300, town: 80, market: 120, fertilizerName: 80 } as const;
/** Usual price of one plant, in the nursery's currency; stored in cents. */
export const PRICE_MAX = 10_000;

function text(label: string, max: number, required = true) {
	const base = z.string({ error: `Enter ${label}` }).trim();
	const limited = base.max(max, `${label[0].toUpperCase()}${label.slice(1)} has at most ${max} characters`);
	return required ? limited.min(1, `Enter ${label}`) : limited;
}

/** Form inputs arrive as text: blank means "not given", numbers are read, anything else stays text so zod names it. */
function readNumber(value: unknown): unknown {
	if (typeof value !== 'string') return value;
	const v = value.trim().replace(',', '.');
	if (v === '') return undefined;
	return Number.isNaN(Number(v)) ? v : Number(v);
}

/** "Enter a number from 25 to 70" (whole numbers where the bound says so). */
export function boundMessage(b: ParameterBound): string {
	return `Enter a ${b.integer ? 'whole number' : 'number'} from ${b.min} to ${b.max}${b.unit.startsWith('%') || b.unit.startsWith('°') ? '' : ' '}${b.unit}`;
}

function boundedNumberOf(b: ParameterBound) {
	const message = boundMessage(b);
	const n = z.number({ error: message }).min(b.min, message).max(b.max, message);
	return b.integer ? n.int(message) : n;
}

export const boundedNumber = (b: ParameterBound) => z.preprocess(readNumber, boundedNumberOf(b));
/** Blank means "none". */
export const optionalBoundedNumber = (b: ParameterBound) => z.preprocess(readNumber, boundedNumberOf(b).optional());

const parameterShape = Object.fromEntries(CULTIVAR_PARAMETER_NAMES.map((name) => [name, boundedNumber(CULTIVAR_PARAMETER_BOUNDS[name])])) as Record<
	CultivarParameterName,
	ReturnType<typeof boundedNumber>
>;

const priceMessage = `Enter a price from 0 to ${PRICE_MAX}, like 12.50, or leave it blank`;
const priceField = z.preprocess(
	readNumber,
	z
		.number({ error: priceMessage })
		.min(0, priceMessage)
		.max(PRICE_MAX, priceMessage)
		.refine((p) => Math.abs(p * 100 - Math.round(p * 100)) < 1e-6, 'Give the price to the cent at most, like 12.50')
		.optional()
);

export const cultivarFormSchema = z.object({
	name: text('a name', TEXT_LIMITS.name),
	group: z.enum(CULTIVAR_GROUPS, { error: `Choose a genome group: ${CULTIVAR_GROUPS.join(', ')}` }),
	subgroup: text('a subgroup or type', TEXT_LIMITS.subgroup),
	size: z.enum(SIZE_CLASSES, { error: `Choose a size: ${SIZE_CLASSES.join(', ')}` }),
	notes: text('notes', TEXT_LIMITS.notes, false).default(''),
	usualPrice: priceField,
	...parameterShape,
	/** Where the values changed in this save come from (the nursery's own records, a trial, …). */
	sourceNote: text('a source note', TEXT_LIMITS.sourceNote, false).default('')
});
export type CultivarForm = z.infer<typeof cultivarFormSchema>;

export const retireFormSchema = z.object({ retire: z.enum(['yes', 'no'], { error: 'Say whether to retire or restore the cultivar' }) });

export const climateFormSchema = z.object({
	name: text('a name', TEXT_LIMITS.name),
	monthlyMeanC: z.preprocess((v) => (Array.isArray(v) ? v.map(readNumber) : v), monthlyMeansField),
	sourceNote: text('where the means come from', TEXT_LIMITS.sourceNote)
});
export type ClimateForm = z.infer<typeof climateFormSchema>;

/** IANA zones the runtime knows, plus UTC (which some runtimes list only as "Etc/UTC"). */
export function timeZones(): string[] {
	const zones = Intl.supportedValuesOf('timeZone');
	return zones.includes('UTC') ? zones : ['UTC', ...zones];
}

const monthField = z.preprocess(readNumber, z.number({ error: 'Choose months from the list' }).int('Choose months from the list').min(1, 'Choose months from the list').max(12, 'Choose months from the list'));

const F = FEEDING_SETTING_BOUNDS;
export const settingsFormSchema = z
	.object({
		name: text('the nursery name', TEXT_LIMITS.name),
		town: text('the town', TEXT_LIMITS.town),
		market: text('the market', TEXT_LIMITS.market),
		timeZone: z
			.string({ error: 'Choose a time zone' })
			.trim()
			.refine((zone) => timeZones().includes(zone), 'Choose a time zone from the list, like Europe/Lisbon'),
		units: unitsField,
		defaultClimate: climateSlugField,
		fertilizerName: text('the fertilizer name', TEXT_LIMITS.fertilizerName),
		npkN: boundedNumber(F.npkEach),
		npkP: boundedNumber(F.npkEach),
		npkK: boundedNumber(F.npkEach),
		fullRationG: boundedNumber(F.fullRationG),
		handfulG: boundedNumber(F.handfulG),
		restrictedMonths: z.preprocess((v) => (v === undefined ? [] : Array.isArray(v) ? v : [v]), z.array(monthField).max(12)),
		nitrogenCapKgPer100m2: optionalBoundedNumber(F.nitrogenCapKgPer100m2)
	})
	.superRefine((s, ctx) => {
		if (s.npkN + s.npkP + s.npkK > F.npkTotalMax) ctx.addIssue({ code: 'custom', path: ['npkK'], message: `N, P and K add up to at most ${F.npkTotalMax} %` });
		if (s.npkN + s.npkP + s.npkK === 0) ctx.addIssue({ code: 'custom', path: ['npkN'], message: 'A fertilizer has at least one nutrient above 0 %' });
		if (s.handfulG > s.fullRationG) ctx.addIssue({ code: 'custom', path: ['handfulG'], message: 'A handful is at most the full ration' });
	});
export type SettingsForm = z.infer<typeof settingsFormSchema>;

/** Sent by the confirmation button only, so a stray post cannot delete anything. */
export const confirmDeleteSchema = z.object({ confirm: z.literal('yes', { error: 'Confirm the delete with the button on the confirmation' }) });
