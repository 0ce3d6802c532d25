import { fail } from '@sveltejs/kit';
import type { z } from 'zod';
import { echoable, formToObject, parseForm } from '../schema/form';
import { UserFacingError } from './errors';

/**
 * The shape of every form action: parse with the shared schema, run the service,
 * and turn a refusal into a 4xx beside the named field. Nothing is written on refusal.
 */
export async function runForm<S extends z.ZodType, R>(
	request: Request,
	schema: S,
	work: (data: z.infer<S>) => Promise<R>
) {
	const form = await request.formData().catch(() => new FormData());
	return runFormData(form, schema, work);
}

/** The same, for an action that has read the form itself (to take a file from it). */
export async function runFormData<S extends z.ZodType, R>(form: FormData, schema: S, work: (data: z.infer<S>) => Promise<R>) {
	const parsed = parseForm(schema, form);
	if (!parsed.ok) return { failure: fail(400, { errors: parsed.errors, values: parsed.values }) };
	try {
		return { result: await work(parsed.data) };
	} catch (e) {
		if (e instanceof UserFacingError) {
			return { failure: fail(e.status, { errors: { [e.field]: e.message }, values: echoable(formToObject(form)) }) };
		}
		throw e;
	}
}

/** The non-empty files a form sent under `name` (a file input left empty sends one empty file). */
export const filesOf = (form: FormData, name: string): File[] => form.getAll(name).filter((f): f is File => f instanceof File && f.size > 0);
