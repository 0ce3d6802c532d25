import { redirect } from '@sveltejs/kit';
import { climateFormSchema } from '$lib/schema/catalogue';
import { requireUser } from '$lib/server/auth';
import { catalogueEditor } from '$lib/server/catalogue/editor';
import { catalogueService } from '$lib/server/catalogue/service';
import { runForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, 'owner');
	const s = await catalogueService.snapshot();
	const climates = s.climates.map(({ climate, nurserys }) => ({
		slug: climate.slug,
		name: climate.name,
		nurserys,
		isDefault: climate.slug === s.settings.defaultClimate,
		monthlyMeanC: climate.monthlyMeanC,
		note: 'note' in climate.source ? (climate.source.note ?? '') : ''
	}));
	return { climates, deleted: event.url.searchParams.get('deleted') };
};

export const actions: Actions = {
	default: async (event) => {
		const me = requireUser(event, 'owner');
		const { failure, result } = await runForm(event.request, climateFormSchema, (d) => catalogueEditor.addClimate(d, me.id));
		if (failure) return failure;
		redirect(303, `/nursery/climates/${result}?saved=added`);
	}
};
