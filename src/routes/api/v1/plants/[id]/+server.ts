import { json } from '@sveltejs/kit';
import { apiRoute, parseInput, readJson } from '$lib/server/api';
import { requireUser } from '$lib/server/auth';
import { plantService } from '$lib/server/plants/plant-service';
import { pathId, plantResponse } from '$lib/server/plants/api';
import { moveJson } from '$lib/server/plants/json';
import { plantPatchSchema } from '$lib/schema/plant';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event);
	return json(await plantResponse(user, pathId(event.params.id, 'plant')));
});

export const PATCH: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event);
	const id = pathId(event.params.id, 'plant');
	const patch = parseInput(plantPatchSchema, await readJson(event.request));
	const { moved } = await plantService.update(user, id, patch);
	return json({ ...(await plantResponse(user, id)), moved: moved.map(moveJson) });
});
