/**
 * What pages show of the nursery settings. The settings are read through the catalogue service
 * (one cached snapshot with the cultivars and climates), so every plan and page agree.
 */
import { catalogueService, type CatalogueService } from '../catalogue/service';

export function createNurseryService(catalogue: Pick<CatalogueService, 'snapshot' | 'planningContext' | 'feedingSettings'>) {
	return {
		feedingSettings: catalogue.feedingSettings,
		planningContext: catalogue.planningContext,
		publicProfile: async () => {
			const { name, town, market } = (await catalogue.snapshot()).settings;
			return { name, town, market };
		},
		/** What the owner's dashboard shows of the settings, with the climate by name. */
		async dashboard() {
			const s = await catalogue.snapshot();
			const { name, town, market, configured } = s.settings;
			const feeding = configured
				? {
						fertilizer: s.settings.fertilizerName,
						npk: s.settings.npk,
						climate: s.climate(s.settings.defaultClimate)?.climate.name ?? s.settings.defaultClimate,
						restrictedMonths: s.settings.restrictedMonths
					}
				: null;
			return { profile: { name, town, market }, feeding };
		}
	};
}

export const nurseryService = createNurseryService(catalogueService);
