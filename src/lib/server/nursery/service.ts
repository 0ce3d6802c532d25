import { nurseryRepository } from './repository';

/** Shown before the owner has set the nursery up. */
const UNNAMED = { name: 'Your nursery', town: 'your town', market: 'the market' };

export const nurseryService = {
	settings: () => nurseryRepository.settings(),
	async publicProfile() {
		const s = await nurseryRepository.settings();
		return s ? { name: s.name, town: s.town, market: s.market } : UNNAMED;
	}
};
