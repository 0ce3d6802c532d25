import { z } from 'zod';

/** A row id in a URL: a positive integer, or nothing (so a malformed id is a 404 like a missing one). */
export function idParam(raw: string): number | null {
	const parsed = z.coerce.number().int().positive().max(2_147_483_647).safeParse(raw);
	return parsed.success && /^\d+$/.test(raw) ? parsed.data : null;
}
