import { json } from '@sveltejs/kit';
import { apiRoute, parseInput, readJson } from '$lib/server/api';
import { requireUser } from '$lib/server/auth';
import { plantService } from '$lib/server/plants/plant-service';
import { pathId, plantResponse } from '$lib/server/plants/api';
import { milestoneJson, moveJson } from '$lib/server/plants/json';
import { milestonePatchSchema } from '$lib/schema/plant';
import type { RequestHandler } from './$types';

export const PATCH: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event);
	const id = pathId(event.params.id, 'plant');
	const milestoneId = pathId(event.params.milestoneId, 'milestone');
	const patch = parseInput(milestonePatchSchema, await readJson(event.request));
	const { milestone, moved } = await plantService.correct(user, id, milestoneId, patch);
	const body = await plantResponse(user, id);
	return json({ ...body, milestone: milestoneJson(milestone, body.plant.units ?? 'metric'), moved: moved.map(moveJson) });
});

export const DELETE: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event);
	const id = pathId(event.params.id, 'plant');
	const { moved } = await plantService.remove(user, id, pathId(event.params.milestoneId, 'milestone'));
	return json({ ...(await plantResponse(user, id)), moved: moved.map(moveJson) });
});
