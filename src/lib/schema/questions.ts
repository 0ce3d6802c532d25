import { z } from 'zod';
import { BOARD_BOUNDS, QUESTION_STATES } from '../board/vocabulary';
import { titleField } from './guides';

const b = BOARD_BOUNDS;

const checkbox = z.preprocess((v) => v === 'on' || v === 'true' || v === 'yes', z.boolean());
const rowId = (message: string) => z.coerce.number({ error: message }).int(message).positive(message).max(2_147_483_647, message);

export const askSchema = z.object({
	title: titleField,
	body: z
		.string({ error: 'Describe what you see' })
		.trim()
		.min(b.questionBody.min, `Describe what you see in at least ${b.questionBody.min} characters`)
		.max(b.questionBody.max, `A question has at most ${b.questionBody.max.toLocaleString('en')} characters`),
	/** Empty: not about one plant. */
	plantId: z.union([z.literal('').transform(() => null), rowId('Choose one of your plants')]).optional().default(null),
	isPublic: checkbox.optional().default(false)
});
export type AskInput = z.infer<typeof askSchema>;

export const postSchema = z.object({
	body: z
		.string({ error: 'Write something first' })
		.trim()
		.min(b.postBody.min, 'Write something first')
		.max(b.postBody.max, `At most ${b.postBody.max.toLocaleString('en')} characters`)
});

export const stateSchema = z.object({ state: z.enum(QUESTION_STATES, { error: 'Choose a state from the list' }) });
export const acceptSchema = z.object({ postId: rowId('Choose an answer') });
export const toGuideSchema = z.object({ postId: rowId('Choose an answer') });

/** Queue tabs: one state, or every state. */
export const queueFilterSchema = z.object({ state: z.enum([...QUESTION_STATES, 'all']).catch('waiting') });
