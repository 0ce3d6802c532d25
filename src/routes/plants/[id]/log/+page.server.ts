import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/auth';
import { runFormData } from '$lib/server/forms';
import { plantIdOf, plantPage } from '$lib/server/plants/page';
import { plantService } from '$lib/server/plants/plant-service';
import { milestonePatchSchema, milestoneSchema } from '$lib/schema/plant';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireUser(event);
	const view = await plantPage(user, event.params.id);
	return { plant: view.plant, access: view.access, today: view.today, milestones: view.milestones };
};

const milestoneIdSchema = z.object({ milestoneId: z.coerce.number({ error: 'Choose a milestone' }).int().positive('Choose a milestone') });
const photoOf = (form: FormData) => {
	const photo = form.get('photo');
	return photo instanceof File && photo.size > 0 ? photo : undefined;
};
/** The correction form sends every field; only those filled in change. */
const correctionSchema = milestoneIdSchema.extend(milestonePatchSchema.shape);

export const actions: Actions = {
	log: async (event) => {
		const user = requireUser(event);
		const id = plantIdOf(event.params.id);
		const form = await event.request.formData().catch(() => new FormData());
		const { failure, result } = await runFormData(form, milestoneSchema, (data) => plantService.log(user, id, data, photoOf(form)));
		if (failure) return failure;
		redirect(303, result.dividedPlantId ? `/plants/${id}?divided=${result.dividedPlantId}` : `/plants/${id}?logged=1`);
	},
	correct: async (event) => {
		const user = requireUser(event);
		const id = plantIdOf(event.params.id);
		const form = await event.request.formData().catch(() => new FormData());
		const { failure } = await runFormData(form, correctionSchema, ({ milestoneId, ...patch }) => plantService.correct(user, id, milestoneId, patch, photoOf(form)));
		if (failure) return failure;
		redirect(303, `/plants/${id}?logged=1`);
	},
	delete: async (event) => {
		const user = requireUser(event);
		const id = plantIdOf(event.params.id);
		const form = await event.request.formData().catch(() => new FormData());
		const { failure } = await runFormData(form, milestoneIdSchema, ({ milestoneId }) => plantService.remove(user, id, milestoneId));
		if (failure) return failure;
		redirect(303, `/plants/${id}?logged=1`);
	}
};
