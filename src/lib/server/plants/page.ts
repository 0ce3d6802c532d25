/** What the plant pages share: the plant from the path, or the 404 that hides another gardener's plant. */
import { error } from '@sveltejs/kit';
import { UserFacingError } from '../errors';
import type { AuthUser } from '../auth/guard';
import { pathId } from './api';
import { plantService } from './plant-service';

export async function plantPage(user: AuthUser, rawId: string) {
	try {
		return await plantService.page(user, pathId(rawId, 'plant'));
	} catch (e) {
		if (e instanceof UserFacingError && e.status === 404) error(404, 'No such plant');
		throw e;
	}
}

/** The id of the path for an action; a bad one is the same 404 as a plant that is not yours. */
export function plantIdOf(rawId: string): number {
	try {
		return pathId(rawId, 'plant');
	} catch {
		error(404, 'No such plant');
	}
}
