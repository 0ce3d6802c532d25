/**
 * One plant as its owner and the nursery see it, in a scope (a gardener's own, or all for staff),
 * with its stage and next step from `plantStatus`. Lists of plants, with filters, sorting and
 * counts over the stored stage and next step, are the nursery table's (src/lib/server/plant-table). A gardener asking for a
 * plant that is not theirs gets the same 404 as for one that does not exist.
 */
import { eq } from 'drizzle-orm';
import type { Cultivar, FeedingSettings } from '../../care';
import { plants } from '../db/schema';
import { UserFacingError } from '../errors';
import type { AnyDb } from '../secrets';
import { plantFilters, plantsRepository, type PlantListRow, type PlantScope } from './repository';
import { plantStatus, type PlantStatus } from './status';

export type { PlantScope };

/** Staff and the owner see every plant; a gardener only their own. */
export const scopeFor = (user: { id: number; role: string }): PlantScope => (user.role === 'gardener' ? { kind: 'gardener', gardenerId: user.id } : { kind: 'all' });

export interface PlantsDeps {
	db: AnyDb;
	cultivarById: (id: number) => Promise<{ cultivar: Cultivar } | undefined>;
	feeding: () => Promise<FeedingSettings>;
}

export interface PlantView extends PlantStatus {
	id: number;
	saleId: number | null;
	cultivar: { slug: string; name: string };
	soldOn: string;
	claimed: boolean;
	plantedOn: string | null;
	climate: string | null;
	units: 'metric' | 'imperial' | null;
	/** Only in the nursery's view (scope "all"): who claimed it. */
	gardener?: { id: number; name: string } | null;
}

export function createPlantsService({ db, cultivarById, feeding }: PlantsDeps) {
	const repo = plantsRepository(db);

	async function views(rows: PlantListRow[], scope: PlantScope, today: string): Promise<PlantView[]> {
		const settings = await feeding();
		const cultivarCache = new Map<number, Promise<{ cultivar: Cultivar } | undefined>>();
		return Promise.all(
			rows.map(async (r) => {
				if (!cultivarCache.has(r.cultivarId)) cultivarCache.set(r.cultivarId, cultivarById(r.cultivarId));
				const stored = await cultivarCache.get(r.cultivarId);
				const status = stored
					? plantStatus(
							{ cultivar: stored.cultivar, plantedOn: r.plantedOn, ageAtPlantingWeeks: r.ageAtPlantingWeeks, monthlyMeanC: r.customMonthlyMeanC ?? r.profileMeans, units: r.units ?? 'metric' },
							settings,
							today
						)
					: { stage: null, nextStep: null };
				return {
					id: r.id,
					saleId: r.saleId,
					cultivar: { slug: r.cultivarSlug, name: r.cultivarName },
					soldOn: r.soldOn,
					claimed: r.claimedAt !== null,
					plantedOn: r.plantedOn,
					climate: r.customMonthlyMeanC ? 'own monthly means' : r.climateName,
					units: r.units,
					...status,
					...(scope.kind === 'all' ? { gardener: r.gardenerId !== null ? { id: r.gardenerId, name: r.gardenerName ?? '' } : null } : {})
				};
			})
		);
	}

	return {
		/**
		 * A page of plants in a scope with their status, for "My plants". The nursery's table and
		 * the API list through the plant table's service instead (filters, sort, stored stages).
		 */
		async page(scope: PlantScope, query: { page: number; size: number }, today: string) {
			const where = plantFilters(scope);
			const total = await repo.count(where);
			// A page past the end shows the last page rather than an empty list.
			const page = Math.min(query.page, Math.max(1, Math.ceil(total / query.size)));
			const rows = await repo.page(where, query.size, (page - 1) * query.size);
			return { plants: await views(rows, scope, today), total, page, size: query.size };
		},

		/** One plant in a scope; 404 when it is missing or belongs to someone else. */
		async one(scope: PlantScope, id: number, today: string): Promise<PlantView> {
			const row = await repo.one([...plantFilters(scope), eq(plants.id, id)]);
			if (!row) throw new UserFacingError('id', 'No such plant', 404);
			return (await views([row], scope, today))[0];
		}
	};
}

export type PlantsService = ReturnType<typeof createPlantsService>;
