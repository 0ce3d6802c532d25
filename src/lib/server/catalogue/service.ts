/**
 * The one way the product reads the catalogue: cultivars, climate profiles and the nursery's
 * feeding settings, from the database, in the engine's shapes. The planner, the public API, stored
 * plans, the stall and the care cards all read through here; the engine itself never reads the
 * database. The snapshot is cached in memory per catalogue version (see `versionedCache`).
 */
import { catalogueRepository, type CatalogueRepository } from './repository';
import { buildSnapshot, versionedCache, type CatalogueSnapshot } from './snapshot';

export type { CatalogueSnapshot, NurserySettings, StoredClimate, StoredCultivar } from './snapshot';
export { toStoredClimate, toStoredCultivar } from './snapshot';

export function createCatalogueService(repo: Pick<CatalogueRepository, 'version' | 'rows'>) {
	const cache = versionedCache(repo.version, async () => buildSnapshot(await repo.rows()));
	const snapshot = (): Promise<CatalogueSnapshot> => cache.get();
	return {
		/** Everything at once, from one cache check: use it when a request needs several parts. */
		snapshot,
		/** Offered cultivars by name; with `includeRetired`, the retired ones too (plants already sold keep theirs). */
		cultivars: async (includeRetired = false) => {
			const s = await snapshot();
			return includeRetired ? s.cultivars : s.offeredCultivars;
		},
		/** Any cultivar, retired ones included: a plan of a plant already sold must still read it. */
		cultivarBySlug: async (slug: string) => (await snapshot()).cultivar(slug),
		cultivarById: async (id: number) => (await snapshot()).cultivarById(id),
		/** The nursery's own profiles first, then the built-in ones, each by name. */
		climates: async () => (await snapshot()).climates,
		climateBySlug: async (slug: string) => (await snapshot()).climate(slug),
		climateById: async (id: number) => (await snapshot()).climateById(id),
		settings: async () => (await snapshot()).settings,
		/** The fertilizer, scoop and local rules every plan is fed with. */
		feedingSettings: async () => (await snapshot()).feeding,
		/** What a plan needs of the settings: the feeding and the nursery's time zone (for "today"). */
		planningContext: async () => {
			const s = await snapshot();
			return { feeding: s.feeding, timeZone: s.settings.timeZone };
		}
	};
}

export type CatalogueService = ReturnType<typeof createCatalogueService>;
export const catalogueService = createCatalogueService(catalogueRepository);
