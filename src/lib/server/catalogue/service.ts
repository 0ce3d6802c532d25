/**
 * The catalogue as the rest of the product sees it: cultivars and climate profiles from the
 * database, in the engine's shapes, with their row ids. Every plan reads its cultivar and
 * climate through here; the engine itself never reads the database.
 */
import type { ClimateProfile, Cultivar } from '../../care';
import { catalogueRepository, type CatalogueRepository, type ClimateRow, type CultivarRow } from './repository';
import { rowToClimate, rowToCultivar } from './mapping';

export interface StoredCultivar {
	id: number;
	cultivar: Cultivar;
	usualPriceCents: number | null;
	builtIn: boolean;
	retired: boolean;
}

export interface StoredClimate {
	id: number;
	climate: ClimateProfile;
	/** The nursery's own profile (listed first to buyers, who mostly garden near the nursery). */
	nurserys: boolean;
}

export const toStoredCultivar = (r: CultivarRow): StoredCultivar => ({
	id: r.id,
	cultivar: rowToCultivar(r),
	usualPriceCents: r.usualPriceCents,
	builtIn: r.builtIn,
	retired: r.retiredAt !== null
});

export const toStoredClimate = (r: ClimateRow): StoredClimate => ({ id: r.id, climate: rowToClimate(r), nurserys: !r.builtIn });

/** A lookup that maps the row it finds and passes "not found" on as undefined. */
const mapped =
	<K, R, T>(find: (key: K) => Promise<R | undefined>, map: (r: R) => T) =>
	async (key: K): Promise<T | undefined> => {
		const r = await find(key);
		return r ? map(r) : undefined;
	};

export function createCatalogueService(repo: CatalogueRepository) {
	return {
		cultivars: async (includeRetired = false) => (await repo.cultivars(includeRetired)).map(toStoredCultivar),
		cultivarBySlug: mapped(repo.cultivarBySlug, toStoredCultivar),
		cultivarById: mapped(repo.cultivarById, toStoredCultivar),
		/** The nursery's own profiles first, then the built-in ones, each by name. */
		climates: async () => (await repo.climates()).map(toStoredClimate),
		climateBySlug: mapped(repo.climateBySlug, toStoredClimate),
		climateById: mapped(repo.climateById, toStoredClimate)
	};
}

export const catalogueService = createCatalogueService(catalogueRepository);
