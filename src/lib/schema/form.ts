import type { z } from 'zod';

export type FieldErrors = Record<string, string>;

/** First message per field, keyed by the dotted path, for showing beside each input. */
export function fieldErrors(error: z.ZodError): FieldErrors {
	const out: FieldErrors = {};
	for (const issue of error.issues) {
		const key = issue.path.join('.') || 'form';
		out[key] ??= issue.message;
	}
	return out;
}

/** Reads a form into a plain object; repeated names become arrays. Files are dropped. */
export function formToObject(data: FormData): Record<string, string | string[]> {
	// A Map, not an object: a field named "toString" must not meet Object.prototype. No form of
	// ours has a "__proto__" field, and SvelteKit cannot echo one back: it is dropped.
	const out = new Map<string, string | string[]>();
	for (const [key, value] of data.entries()) {
		if (typeof value !== 'string' || key === '__proto__') continue;
		const prev = out.get(key);
		out.set(key, prev === undefined ? value : Array.isArray(prev) ? [...prev, value] : [prev, value]);
	}
	return Object.fromEntries(out);
}

/** Secrets are never echoed back into a form. */
export function echoable(raw: Record<string, string | string[]>): Record<string, string | string[]> {
	return Object.fromEntries(Object.entries(raw).filter(([k]) => !/password|token/i.test(k)));
}

export type Parsed<T> = { ok: true; data: T } | { ok: false; errors: FieldErrors; values: Record<string, unknown> };

export function parseForm<S extends z.ZodType>(schema: S, data: FormData): Parsed<z.infer<S>> {
	const raw = formToObject(data);
	const result = schema.safeParse(raw);
	if (result.success) return { ok: true, data: result.data };
	return { ok: false, errors: fieldErrors(result.error), values: echoable(raw) };
}
