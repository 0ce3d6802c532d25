import { error } from '@sveltejs/kit';
import { CULTIVAR_PARAMETER_NAMES } from '$lib/care';
import { cultivarFormValues, fieldLabel, sourceText, valueText } from '$lib/catalogue/changes';
import { cultivarFormSchema, retireFormSchema } from '$lib/schema/catalogue';
import { pageQuery } from '$lib/schema/paging';
import { requireUser } from '$lib/server/auth';
import { catalogueEditor } from '$lib/server/catalogue/editor';
import { cultivarToRow, parametersOf } from '$lib/server/catalogue/mapping';
import { catalogueService } from '$lib/server/catalogue/service';
import { runForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, 'owner');
	const stored = await catalogueService.cultivarBySlug(event.params.slug);
	if (!stored) error(404, 'No such cultivar');
	const { page, size } = pageQuery(event.url);
	const [history, plantsSold] = await Promise.all([catalogueEditor.history(stored.id, page, size), catalogueEditor.plantsOfCultivar(stored.id)]);
	const parameters = parametersOf(stored.cultivar);
	return {
		slug: stored.cultivar.slug,
		name: stored.cultivar.name,
		builtIn: stored.builtIn,
		retired: stored.retired,
		plantsSold,
		values: cultivarFormValues({ ...cultivarToRow(stored.cultivar), usualPriceCents: stored.usualPriceCents }),
		sources: Object.fromEntries(CULTIVAR_PARAMETER_NAMES.map((n) => [n, parameters[n] ? sourceText(parameters[n].source) : ''])),
		confirmRetire: event.url.searchParams.get('confirm') === 'retire',
		saved: event.url.searchParams.get('saved'),
		history: {
			...history,
			rows: history.rows.map((r) => ({ id: r.id, at: r.at.toISOString(), by: r.by ?? 'a former account', field: fieldLabel(r.field), from: valueText(r.field, r.oldValue), to: valueText(r.field, r.newValue), created: r.field === 'created' }))
		}
	};
};

export const actions: Actions = {
	save: async (event) => {
		const me = requireUser(event, 'owner');
		const { failure, result } = await runForm(event.request, cultivarFormSchema, (d) => catalogueEditor.editCultivar(event.params.slug, d, me.id));
		return failure ?? { changed: result };
	},
	retire: async (event) => {
		const me = requireUser(event, 'owner');
		const { failure, result } = await runForm(event.request, retireFormSchema, async (d) => ({
			retired: d.retire === 'yes',
			changed: await catalogueEditor.setRetired(event.params.slug, d.retire === 'yes', me.id)
		}));
		return failure ?? result;
	}
};
