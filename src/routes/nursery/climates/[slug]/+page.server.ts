import { error, redirect } from '@sveltejs/kit';
import { climateFormSchema, confirmDeleteSchema } from '$lib/schema/catalogue';
import { requireUser } from '$lib/server/auth';
import { catalogueEditor } from '$lib/server/catalogue/editor';
import { catalogueService } from '$lib/server/catalogue/service';
import { runForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, 'owner');
	const s = await catalogueService.snapshot();
	const stored = s.climate(event.params.slug);
	// Built-in profiles are listed on /nursery/climates but are not the nursery's to edit.
	if (!stored || !stored.nurserys) error(404, 'No such climate profile of the nursery');
	const usage = await catalogueEditor.climateUsage(stored.id, stored.climate.slug, s.settings.defaultClimate);
	return {
		slug: stored.climate.slug,
		name: stored.climate.name,
		values: {
			name: stored.climate.name,
			monthlyMeanC: stored.climate.monthlyMeanC.map(String),
			sourceNote: 'note' in stored.climate.source ? (stored.climate.source.note ?? '') : ''
		},
		usage,
		confirmDelete: event.url.searchParams.get('confirm') === 'delete',
		saved: event.url.searchParams.get('saved')
	};
};

export const actions: Actions = {
	save: async (event) => {
		requireUser(event, 'owner');
		const { failure } = await runForm(event.request, climateFormSchema, (d) => catalogueEditor.editClimate(event.params.slug, d));
		return failure ?? { saved: true };
	},
	delete: async (event) => {
		requireUser(event, 'owner');
		const { failure } = await runForm(event.request, confirmDeleteSchema, () => catalogueEditor.deleteClimate(event.params.slug));
		if (failure) return failure;
		redirect(303, '/nursery/climates?deleted=1');
	}
};

