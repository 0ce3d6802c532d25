import { redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth';
import { runForm } from '$lib/server/forms';
import { catalogueService } from '$lib/server/catalogue/service';
import { plantIdOf, plantPage } from '$lib/server/plants/page';
import { plantService } from '$lib/server/plants/plant-service';
import { plantSettingsFormSchema } from '$lib/schema/plant';
import { z } from 'zod';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireUser(event);
	const view = await plantPage(user, event.params.id);
	const climates = view.access === 'edit' ? (await catalogueService.climates()).map((c) => ({ slug: c.climate.slug, name: c.climate.name })) : [];
	return { ...view, climates };
};

const archiveSchema = z.object({ archived: z.enum(['true', 'false'], { error: 'Choose archive or restore' }) });

export const actions: Actions = {
	settings: async (event) => {
		const user = requireUser(event);
		const id = plantIdOf(event.params.id);
		const { failure } = await runForm(event.request, plantSettingsFormSchema, (data) => plantService.update(user, id, data));
		if (failure) return failure;
		redirect(303, `/plants/${id}?saved=settings`);
	},
	archive: async (event) => {
		const user = requireUser(event);
		const id = plantIdOf(event.params.id);
		const { failure } = await runForm(event.request, archiveSchema, (data) => plantService.update(user, id, { archived: data.archived === 'true' }));
		if (failure) return failure;
		redirect(303, `/plants/${id}`);
	}
};
