/** Field rules every form and endpoint shares: text without control characters, ids in range. */
import { z } from 'zod';

/** PostgreSQL's integer: every id column. Larger numbers are refused by the schema, not by the database. */
export const ID_MAX = 2_147_483_647;

/** C0 and C1 control characters (NUL, escape, line breaks…): never part of a name, an e-mail or a title. */
export const CONTROL_CHARACTERS = /[\u0000-\u001f\u007f-\u009f]/;
/** Bidirectional overrides and isolates: they reorder text in e-mail bodies and pages (spoofing). */
export const BIDI_CONTROLS = /[\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/;

/** Control characters a typed text may not hold: line breaks and tabs are fine, NUL and escapes are not (PostgreSQL refuses NUL). */
export const TEXT_CONTROL_CHARACTERS = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;
export const TEXT_CONTROL_MESSAGE = 'Remove the control characters (invisible codes pasted with the text)';
/** For multi-line texts (question bodies, answers, guides): refuses TEXT_CONTROL_CHARACTERS. */
export const withoutControls = (v: string) => !TEXT_CONTROL_CHARACTERS.test(v);

export const idField = (message = 'Unknown id') =>
	z.coerce.number({ error: message }).int(message).positive(message).max(ID_MAX, message);

/** A one-line text with a length limit; too long is refused with a message, never cut. */
export function lineField(o: { required: string; max: number; tooLong: string; bidi?: boolean }) {
	return z
		.string({ error: o.required })
		.trim()
		.min(1, o.required)
		.max(o.max, o.tooLong)
		.refine((v) => !CONTROL_CHARACTERS.test(v), 'Remove the control characters (such as line breaks or tabs)')
		.refine((v) => !o.bidi || !BIDI_CONTROLS.test(v), 'Remove the invisible direction marks');
}
