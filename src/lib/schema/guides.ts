import { z } from 'zod';
import { CONTROL_CHARACTERS, TEXT_CONTROL_MESSAGE, idField, withoutControls } from './fields';
import { lineField } from './fields';
import { BOARD_BOUNDS, CULTIVAR_GROUPS, GUIDE_STAGES } from '../board/vocabulary';

const b = BOARD_BOUNDS;

/** Ticked boxes: a form field sent zero, one or many times, each value from the list (errors name the field, not an index). */
const ticked = <T extends string>(list: readonly T[], message: string) =>
	z.preprocess(
		(v) => (v === undefined || v === '' ? [] : Array.isArray(v) ? v : [v]),
		z
			.array(z.string(), { error: message })
			.max(list.length, message)
			.refine((xs) => xs.every((x) => (list as readonly string[]).includes(x)), message)
			.transform((xs) => [...new Set(xs)] as T[])
	);

export const SLUG_PATTERN = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

export const slugField = z
	.string()
	.trim()
	.min(b.slug.min, `A web address has at least ${b.slug.min} characters`)
	.max(b.slug.max, `A web address has at most ${b.slug.max} characters`)
	.regex(SLUG_PATTERN, 'Use lower-case letters, digits and single hyphens, like “feeding-in-winter”');

export const titleField = z
	.string({ error: 'Give it a title' })
	.trim()
	.min(b.title.min, `A title has at least ${b.title.min} characters`)
	.max(b.title.max, `A title has at most ${b.title.max} characters`)
	.refine((v) => !CONTROL_CHARACTERS.test(v), 'Remove the control characters (such as line breaks or tabs)');

export const guideSchema = z.object({
	title: titleField,
	summary: z
		.string({ error: 'Write a one-sentence summary' })
		.trim()
		.min(b.summary.min, 'Write a one-sentence summary')
		.max(b.summary.max, `A summary has at most ${b.summary.max} characters`)
		.refine((v) => !CONTROL_CHARACTERS.test(v), 'Remove the control characters (such as line breaks or tabs)'),
	body: z
		.string({ error: 'Write the guide' })
		.min(b.guideBody.min, 'Write the guide')
		.max(b.guideBody.max, `A guide has at most ${b.guideBody.max.toLocaleString('en')} characters`)
		.refine((s) => s.trim().length > 0, 'Write the guide')
		.refine(withoutControls, TEXT_CONTROL_MESSAGE),
	/** Empty: made from the title. */
	slug: z.union([z.literal(''), slugField]).optional().default(''),
	stages: ticked(GUIDE_STAGES, 'Choose stages from the list'),
	groups: ticked(CULTIVAR_GROUPS, 'Choose cultivar groups from the list'),
	/** The built-in guide this one takes the place of, or empty. */
	replaces: z.string().trim().max(b.slug.max).optional().default('')
});
export type GuideInput = z.infer<typeof guideSchema>;

/** An image for a guide's text: its file travels beside these fields; the words stand in for it in screen readers. */
export const guideImageSchema = z.object({
	alt: lineField({ required: 'Describe the image in a few words (read aloud to those who cannot see it)', max: b.imageAlt.max, tooLong: `At most ${b.imageAlt.max} characters` })
});

export const revisionSchema = z.object({ revision: idField('Choose a revision') });

export const previewSchema = z.object({ markdown: z.string().max(b.guideBody.max, `At most ${b.guideBody.max.toLocaleString('en')} characters`).refine(withoutControls, TEXT_CONTROL_MESSAGE) });

export const guideFilterSchema = z.object({
	stage: z.enum(GUIDE_STAGES).optional().catch(undefined),
	group: z.enum(CULTIVAR_GROUPS).optional().catch(undefined)
});

export const searchSchema = z.object({
	q: z
		.string()
		.trim()
		.min(BOARD_BOUNDS.searchQuery.min, `Type at least ${BOARD_BOUNDS.searchQuery.min} characters`)
		.max(BOARD_BOUNDS.searchQuery.max, `At most ${BOARD_BOUNDS.searchQuery.max} characters`),
	page: z.coerce.number().int().min(1).max(50).catch(1)
});
