import { error } from '@sveltejs/kit';
import { idParam } from '../schema/board';

/** A row id from the URL; a malformed one is the same 404 as a missing row, so ids reveal nothing. */
export function rowIdOr404(raw: string, message: string): number {
	const id = idParam(raw);
	if (!id) error(404, message);
	return id;
}
