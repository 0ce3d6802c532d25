/**
 * Input of the plant page, the milestone log and their JSON API: one schema for the browser form
 * and the server. Dates are checked against the plant (not before planting, not in the future)
 * by the service, which knows the plant and the nursery's today.
 */
import { z } from 'zod';
import { LOSS_REASONS, MILESTONE_BOUNDS, MILESTONE_KINDS } from '$lib/plants/milestones';
import { lineField, TEXT_CONTROL_MESSAGE, withoutControls } from './fields';
import { isoDateField, monthlyMeansField, unitsField } from './plan';

/** A climate profile's slug: built-in or the nursery's own, so the service checks it against the database. */
const climateChoiceField = lineField({ required: 'Choose a climate', max: 80, tooLong: 'Choose a climate from the list' });

/** Blank form inputs mean "not given". */
const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);
/** Form inputs arrive as text; the API sends numbers. */
const numeric = (v: unknown) => {
	const b = blankToUndefined(v);
	return typeof b === 'string' && b.trim() !== '' && !Number.isNaN(Number(b)) ? Number(b) : b;
};
const wholeNumber = (min: number, max: number, what: string) =>
	z.preprocess(numeric, z.number({ error: `Enter ${what} as a whole number from ${min} to ${max}` }).int(`Enter ${what} as a whole number from ${min} to ${max}`).min(min, `Enter ${what} from ${min} to ${max}`).max(max, `Enter ${what} from ${min} to ${max}`));

/** The service checks the upper bound once it knows the plant's units. */
const bunchMassField = z.preprocess(numeric, z.number({ error: 'Enter the weight as a number' }).positive('Enter a weight above zero'));

/** Up to ten stems of one mat, as the engine plans at most ten generations. */
export const MAX_GENERATION = 9;

const noteField = z.preprocess(
	(v) => (v === undefined || v === null ? '' : v),
	z
		.string({ error: 'The note must be text' })
		.trim()
		.max(MILESTONE_BOUNDS.noteLength, `Keep the note under ${MILESTONE_BOUNDS.noteLength} characters`)
		// PostgreSQL refuses a NUL byte in text: refused here, it is a 400 beside the note rather than a 500.
		.refine(withoutControls, TEXT_CONTROL_MESSAGE)
);

/**
 * A milestone as logged. `bunchMass` is in the plant's units: kilograms (metric) or pounds (imperial).
 * Kind-specific values are required where the kind needs them and ignored otherwise.
 */
export const milestoneSchema = z
	.object(
		{
			kind: z.enum(MILESTONE_KINDS, { error: `Choose what happened: one of ${MILESTONE_KINDS.join(', ')}` }),
			on: z.preprocess(blankToUndefined, isoDateField),
			generation: z.preprocess((v) => blankToUndefined(numeric(v)) ?? 0, z.number({ error: 'Choose which stem' }).int('Choose which stem').min(0, 'Choose which stem').max(MAX_GENERATION, 'Choose which stem')),
			leaves: wholeNumber(MILESTONE_BOUNDS.leaves.min, MILESTONE_BOUNDS.leaves.max, 'the leaves').optional(),
			hands: wholeNumber(MILESTONE_BOUNDS.hands.min, MILESTONE_BOUNDS.hands.max, 'the hands').optional(),
			bunchMass: bunchMassField.optional(),
			reason: z.preprocess(blankToUndefined, z.enum(LOSS_REASONS, { error: `Choose a reason: ${LOSS_REASONS.join(', ')}` })).optional(),
			note: noteField.optional()
		},
		{ error: 'The body must be a JSON object' }
	)
	.superRefine((m, ctx) => {
		if (m.kind === 'leaves' && m.leaves === undefined) ctx.addIssue({ code: 'custom', path: ['leaves'], message: 'Enter how many leaves the stem has put out' });
		if (m.kind === 'lost' && m.reason === undefined) ctx.addIssue({ code: 'custom', path: ['reason'], message: 'Choose what the plant was lost to' });
	});
export type MilestoneInput = z.infer<typeof milestoneSchema>;

/** Corrections: the same fields, any of them; the kind stays what it was. */
export const milestonePatchSchema = z
	.object(
		{
			on: z.preprocess(blankToUndefined, isoDateField).optional(),
			leaves: wholeNumber(MILESTONE_BOUNDS.leaves.min, MILESTONE_BOUNDS.leaves.max, 'the leaves').optional(),
			hands: wholeNumber(MILESTONE_BOUNDS.hands.min, MILESTONE_BOUNDS.hands.max, 'the hands').optional(),
			bunchMass: bunchMassField.optional(),
			reason: z.preprocess(blankToUndefined, z.enum(LOSS_REASONS, { error: `Choose a reason: ${LOSS_REASONS.join(', ')}` })).optional(),
			note: noteField.optional()
		},
		{ error: 'The body must be a JSON object' }
	)
	.strict();
export type MilestonePatch = z.infer<typeof milestonePatchSchema>;

/** PATCH /api/v1/plants/[id] and the plant page's settings form. */
export const plantPatchSchema = z
	.object(
		{
			plantedOn: z.preprocess(blankToUndefined, isoDateField).optional(),
			climate: z.union([climateChoiceField, z.object({ monthlyMeanC: monthlyMeansField })], { error: 'Give a climate slug or an object with 12 monthlyMeanC values' }).optional(),
			units: unitsField.optional(),
			archived: z.boolean({ error: 'archived must be true or false' }).optional()
		},
		{ error: 'The body must be a JSON object' }
	)
	.strict()
	.refine((p) => Object.keys(p).length > 0, 'Send at least one of plantedOn, climate, units, archived');
export type PlantPatch = z.infer<typeof plantPatchSchema>;

/** The plant page's settings form: a catalogue climate only (own means are an API feature). */
export const plantSettingsFormSchema = z.object({
	plantedOn: z.preprocess(blankToUndefined, isoDateField),
	climate: climateChoiceField,
	units: unitsField
});
