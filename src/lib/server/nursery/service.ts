import { defaultFeeding, findClimate, referenceClimateSlug, type FeedingSettings } from '../../care';
import { nurseryRepository } from './repository';

type Settings = NonNullable<Awaited<ReturnType<typeof nurseryRepository.settings>>>;

/** Shown before the owner has set the nursery up. */
const UNNAMED = { name: 'Your nursery', town: 'your town', market: 'the market' };

/** The fertilizer and local rules every plan is fed with; the scoop sizes are the engine's. */
function feedingOf(s: Settings | undefined): FeedingSettings {
	if (!s) return defaultFeeding;
	return {
		...defaultFeeding,
		npk: s.npk,
		restrictedMonths: s.restrictedMonths,
		...(s.nitrogenCapKgPer100m2 != null ? { nitrogenCapKgPer100m2: s.nitrogenCapKgPer100m2 } : {})
	};
}

const profileOf = (s: Settings | undefined) => (s ? { name: s.name, town: s.town, market: s.market } : UNNAMED);

export const nurseryService = {
	feedingSettings: async () => feedingOf(await nurseryRepository.settings()),
	publicProfile: async () => profileOf(await nurseryRepository.settings()),
	/** What the planner needs of the settings, from one read. */
	async planningContext(): Promise<{ feeding: FeedingSettings; timeZone: string; defaultClimate: string }> {
		const s = await nurseryRepository.settings();
		return { feeding: feedingOf(s), timeZone: s?.timeZone ?? 'UTC', defaultClimate: s?.defaultClimate ?? referenceClimateSlug };
	},
	/** What the owner's dashboard shows of the settings, from one read, with the climate by name. */
	async dashboard() {
		const s = await nurseryRepository.settings();
		const feeding = s
			? { fertilizer: s.fertilizerName, npk: s.npk, climate: findClimate(s.defaultClimate)?.name ?? s.defaultClimate, restrictedMonths: s.restrictedMonths }
			: null;
		return { profile: profileOf(s), feeding };
	}
};
