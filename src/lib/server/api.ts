/**
 * The public API's one error shape, so clients can show each problem beside the field it names:
 * { "error": { "message": string, "issues": [{ "path": (string|number)[], "message": string }] } }.
 * An empty path means the request as a whole (e.g. a body that is not JSON).
 */
import { isHttpError, json, type RequestHandler } from '@sveltejs/kit';
import type { z } from 'zod';
import { PlanInputError } from '$lib/care';
import { UserFacingError } from './errors';

export interface ApiIssue {
	path: (string | number)[];
	message: string;
}

/** Thrown inside a handler wrapped by `apiRoute`; becomes a 400 with its issues. */
export class ApiInputError extends Error {
	constructor(
		message: string,
		public issues: ApiIssue[]
	) {
		super(message);
	}
}

export function apiError(message: string, issues: ApiIssue[], status = 400): Response {
	return json({ error: { message, issues } }, { status });
}

export function zodIssues(error: z.ZodError): ApiIssue[] {
	return error.issues.map((issue) => ({
		path: issue.path.map((p) => (typeof p === 'symbol' ? String(p) : p)),
		message: issue.message
	}));
}

/** Parses with a shared schema or throws the 400 that names every failing field. */
export function parseInput<S extends z.ZodType>(schema: S, value: unknown): z.infer<S> {
	const result = schema.safeParse(value);
	if (!result.success) throw new ApiInputError('The request has invalid fields', zodIssues(result.error));
	return result.data;
}

const JSON_TYPE = /^application\/(?:[\w.+-]+\+)?json\s*(?:;|$)/i;

/** The request body as JSON, refusing other content types and unparsable text with a 400. */
export async function readJson(request: Request): Promise<unknown> {
	const type = request.headers.get('content-type') ?? '';
	if (!JSON_TYPE.test(type)) {
		throw new ApiInputError('Send the body as JSON', [{ path: [], message: 'Content-Type must be application/json' }]);
	}
	const text = await request.text();
	try {
		return JSON.parse(text);
	} catch {
		throw new ApiInputError('The body is not valid JSON', [{ path: [], message: 'The body is not valid JSON' }]);
	}
}

/**
 * Wraps a handler so refusals become JSON in the one shape (400, or the status the refusal names) and never a 500. Anything else is a bug and is
 * left to SvelteKit's error handling, which logs it.
 */
export function apiRoute(handler: RequestHandler): RequestHandler {
	return async (event) => {
		try {
			return await handler(event);
		} catch (e) {
			if (e instanceof ApiInputError) return apiError(e.message, e.issues);
			// The engine's own refusal, should a schema let one through: still the client's fault.
			if (e instanceof PlanInputError) return apiError('The request has invalid fields', e.issues);
			if (e instanceof UserFacingError) return apiError(e.message, [{ path: e.field ? e.field.split('.') : [], message: e.message }], e.status);
			// The guard's 401 and 403 in the same shape as every other refusal.
			if (isHttpError(e)) return apiError(e.body.message, [], e.status);
			throw e;
		}
	};
}
