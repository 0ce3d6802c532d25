import { z } from 'zod';
import { BOARD_BOUNDS, QUESTION_STATES } from '../board/vocabulary';
import { titleField } from './guides';
import { TEXT_CONTROL_MESSAGE, idField, withoutControls } from './fields';

const b = BOARD_BOUNDS;

const checkbox = z.preprocess((v) => v === 'on' || v === 'true' || v === 'yes', z.boolean());

export const askSchema = z.object({
	title: titleField,
	body: z
		.string({ error: 'Describe what you see' })
		.trim()
		.min(b.questionBody.min, `Describe what you see in at least ${b.questionBody.min} characters`)
		.max(b.questionBody.max, `A question has at most ${b.questionBody.max.toLocaleString('en')} characters`)
		.refine(withoutControls, TEXT_CONTROL_MESSAGE),
	/** Empty: not about one plant. */
	plantId: z.union([z.literal('').transform(() => null), idField('Choose one of your plants')]).optional().default(null),
	isPublic: checkbox.optional().default(false)
});
export type AskInput = z.infer<typeof askSchema>;

export const postSchema = z.object({
	body: z
		.string({ error: 'Write something first' })
		.trim()
		.min(b.postBody.min, 'Write something first')
		.max(b.postBody.max, `At most ${b.postBody.max.toLocaleString('en')} characters`)
		.refine(withoutControls, TEXT_CONTROL_MESSAGE)
});

export const stateSchema = z.object({ state: z.enum(QUESTION_STATES, { error: 'Choose a state from the list' }) });
export const acceptSchema = z.object({ postId: idField('Choose an answer') });
export const toGuideSchema = z.object({ postId: idField('Choose an answer') });

/** Queue tabs: one state, or every state. */
export const queueFilterSchema = z.object({ state: z.enum([...QUESTION_STATES, 'all']).catch('waiting') });
