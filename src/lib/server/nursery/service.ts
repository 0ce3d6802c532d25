import { defaultFeeding, findClimate, type FeedingSettings } from '../../care';
import { nurseryRepository } from './repository';

/** Shown before the owner has set the nursery up. */
const UNNAMED = { name: 'Your nursery', town: 'your town', market: 'the market' };

export const nurseryService = {
	settings: () => nurseryRepository.settings(),
	/** The fertilizer and local rules every plan is fed with; the scoop sizes are the engine's. */
	async feedingSettings(): Promise<FeedingSettings> {
		const s = await nurseryRepository.settings();
		if (!s) return defaultFeeding;
		return {
			...defaultFeeding,
			npk: s.npk,
			restrictedMonths: s.restrictedMonths,
			...(s.nitrogenCapKgPer100m2 != null ? { nitrogenCapKgPer100m2: s.nitrogenCapKgPer100m2 } : {})
		};
	},
	async timeZone(): Promise<string> {
		return (await nurseryRepository.settings())?.timeZone ?? 'UTC';
	},
	/** What the owner's dashboard shows of the settings, with the climate by name. */
	async feedingSummary() {
		const s = await nurseryRepository.settings();
		if (!s) return null;
		return { fertilizer: s.fertilizerName, npk: s.npk, climate: findClimate(s.defaultClimate)?.name ?? s.defaultClimate, restrictedMonths: s.restrictedMonths };
	},
	async publicProfile() {
		const s = await nurseryRepository.settings();
		return s ? { name: s.name, town: s.town, market: s.market } : UNNAMED;
	}
};
