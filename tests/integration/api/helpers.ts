/** Calls +server.ts handlers directly, with just the parts of a RequestEvent they read. */
import { climates, cultivars } from '$lib/care';

type Handler = (event: never) => Response | Promise<Response>;

export const ORIGIN = 'http://bunchline.test';

export function call(handler: Handler, path: string, init?: RequestInit): Promise<Response> {
	const url = new URL(path, ORIGIN);
	return Promise.resolve(handler({ request: new Request(url, init), url } as never));
}

export function postJson(handler: Handler, path: string, body: unknown): Promise<Response> {
	return call(handler, path, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
}

export interface ErrorBody {
	error: { message: string; issues: { path: (string | number)[]; message: string }[] };
}

/** Asserts the 400 error shape and returns the issue paths, dotted, for easy comparison. */
export async function issuePaths(response: Response): Promise<string[]> {
	if (response.status !== 400) throw new Error(`Expected 400, got ${response.status}: ${await response.text()}`);
	const body = (await response.json()) as ErrorBody;
	if (typeof body.error?.message !== 'string' || !Array.isArray(body.error.issues) || body.error.issues.length === 0) {
		throw new Error(`Not the API error shape: ${JSON.stringify(body)}`);
	}
	for (const issue of body.error.issues) {
		if (!Array.isArray(issue.path) || typeof issue.message !== 'string') throw new Error(`Bad issue: ${JSON.stringify(issue)}`);
	}
	return body.error.issues.map((i) => i.path.join('.'));
}

export const validBody = {
	cultivar: cultivars[0].slug,
	plantedOn: '2026-03-15',
	ageAtPlantingWeeks: 12,
	climate: climates[0].slug
};

export { climates, cultivars };
