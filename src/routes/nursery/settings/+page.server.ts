import { settingsFormSchema, timeZones } from '$lib/schema/catalogue';
import { requireUser } from '$lib/server/auth';
import { catalogueEditor } from '$lib/server/catalogue/editor';
import { catalogueService } from '$lib/server/catalogue/service';
import { runForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, 'owner');
	const s = await catalogueService.snapshot();
	const { settings } = s;
	return {
		configured: settings.configured,
		values: {
			name: settings.configured ? settings.name : '',
			town: settings.configured ? settings.town : '',
			market: settings.configured ? settings.market : '',
			timeZone: settings.timeZone,
			units: settings.units,
			defaultClimate: settings.defaultClimate,
			fertilizerName: settings.configured ? settings.fertilizerName : '',
			npkN: String(settings.npk[0]),
			npkP: String(settings.npk[1]),
			npkK: String(settings.npk[2]),
			fullRationG: String(settings.fullRationG),
			handfulG: String(settings.handfulG),
			restrictedMonths: settings.restrictedMonths.map(String),
			nitrogenCapKgPer100m2: settings.nitrogenCapKgPer100m2 === null ? '' : String(settings.nitrogenCapKgPer100m2)
		},
		timeZones: timeZones(),
		climates: s.climates.map(({ climate, nurserys }) => ({ slug: climate.slug, name: climate.name, nurserys }))
	};
};

export const actions: Actions = {
	default: async (event) => {
		requireUser(event, 'owner');
		const { failure } = await runForm(event.request, settingsFormSchema, (d) => catalogueEditor.saveSettings(d));
		return failure ?? { saved: true };
	}
};
