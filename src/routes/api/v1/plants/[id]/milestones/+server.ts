import { json } from '@sveltejs/kit';
import { apiRoute, parseInput, readJson } from '$lib/server/api';
import { requireUser } from '$lib/server/auth';
import { plantService } from '$lib/server/plants/plant-service';
import { pathId, plantResponse } from '$lib/server/plants/api';
import { milestoneJson, moveJson } from '$lib/server/plants/json';
import { milestoneSchema } from '$lib/schema/plant';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = apiRoute(async (event) => {
	const user = requireUser(event);
	const id = pathId(event.params.id, 'plant');
	const input = parseInput(milestoneSchema, await readJson(event.request));
	const { milestone, moved, dividedPlantId } = await plantService.log(user, id, input);
	const body = await plantResponse(user, id);
	return json(
		{ ...body, milestone: milestoneJson(milestone, body.plant.units ?? 'metric'), moved: moved.map(moveJson), dividedPlantId },
		{ status: 201 }
	);
});
