import { redirect } from '@sveltejs/kit';
import { referenceCultivar } from '$lib/care';
import { cultivarFormValues } from '$lib/catalogue/changes';
import { cultivarFormSchema } from '$lib/schema/catalogue';
import { requireUser } from '$lib/server/auth';
import { catalogueEditor } from '$lib/server/catalogue/editor';
import { cultivarToRow } from '$lib/server/catalogue/mapping';
import { runForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, 'owner');
	// A new cultivar starts from the reference cultivar's figures, to be adjusted.
	const reference = cultivarFormValues({ ...cultivarToRow(referenceCultivar()), usualPriceCents: null });
	return { values: { ...reference, name: '', notes: '' } };
};

export const actions: Actions = {
	default: async (event) => {
		const me = requireUser(event, 'owner');
		const { failure, result } = await runForm(event.request, cultivarFormSchema, (d) => catalogueEditor.addCultivar(d, me.id));
		if (failure) return failure;
		redirect(303, `/nursery/cultivars/${result}?saved=added`);
	}
};
