/** What the plant endpoints share: reading the ids of the path and answering with the plant. */
import { UserFacingError } from '../errors';
import type { AuthUser } from '../auth/guard';
import { plantService } from './plant-service';
import { idParam, milestoneJson, plantJson, stepJson } from './json';

export function pathId(raw: string | undefined, field: 'plant' | 'milestone'): number {
	const id = idParam(raw ?? '');
	if (id === undefined) throw new UserFacingError(field === 'plant' ? 'id' : 'milestoneId', field === 'plant' ? 'No such plant' : 'No such milestone', 404);
	return id;
}

/** The plant, its milestones and its stored steps, as GET /api/v1/plants/[id] answers. */
export async function plantResponse(user: Pick<AuthUser, 'id' | 'role'>, id: number) {
	const d = await plantService.detail(user, id);
	const units = d.plant.units ?? 'metric';
	return { plant: plantJson(d), milestones: d.milestones.map((m) => milestoneJson(m, units)), steps: d.steps.map(stepJson) };
}
