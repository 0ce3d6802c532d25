/**
 * The nursery's table of plants: who sees which plants, how filters become a query, and how the
 * total is counted. Staff and the owner see every plant; a gardener sees only their own.
 */
import { EXPORT_COLUMNS, plantTableItem, type PlantTablePage } from '../../plant-table';
import { TABLE_ROW_LIMIT, type PlantTableFilters, type PlantTableQuery } from '../../schema/plant-table';
import type { Role } from '../../schema/auth';
import { UserFacingError } from '../errors';
import { nurseryService } from '../nursery/service';
import { todayIso } from '../plan-preview';
import { plantTableRepository, type PlantTableRepository, type PlantTableWhere } from './repository';

export interface Viewer {
	id: number;
	role: Role;
}

export interface PlantTableDeps {
	repository: PlantTableRepository;
	/** Today in the nursery's time zone. */
	today: () => Promise<string>;
}

const nurseryToday = async () => todayIso(new Date(), (await nurseryService.planningContext()).timeZone);

export function makePlantTableService({ repository, today }: PlantTableDeps) {
	/** The filters as column values; an unknown cultivar or market day is refused by name. */
	async function whereFor(filters: PlantTableFilters, viewer: Viewer, day: string): Promise<PlantTableWhere> {
		const where: PlantTableWhere = {};
		if (viewer.role === 'gardener') Object.assign(where, { gardenerId: viewer.id, activeOnly: true });
		if (filters.cultivar !== undefined) {
			where.cultivarId = await repository.cultivarIdBySlug(filters.cultivar);
			if (where.cultivarId === undefined) throw new UserFacingError('cultivar', 'Unknown cultivar: choose one listed by GET /api/v1/cultivars');
		}
		if (filters.market !== undefined) {
			if (!(await repository.marketDayExists(filters.market))) throw new UserFacingError('market', 'No such market day');
			where.marketDayId = filters.market;
		}
		if (filters.stage !== undefined) where.stage = filters.stage;
		if (filters.claimed !== undefined) where.claimed = filters.claimed === 'yes';
		if (filters.overdue === 'yes') where.overdueBefore = day;
		if (filters.overdue === 'no') where.dueFrom = day;
		return where;
	}

	return {
		async list(query: PlantTableQuery, viewer: Viewer): Promise<PlantTablePage> {
			const day = await today();
			const where = await whereFor(query, viewer, day);
			const [rows, counted] = await Promise.all([
				repository.page(where, query, query.perPage, (query.page - 1) * query.perPage),
				repository.countUpTo(where, TABLE_ROW_LIMIT + 1)
			]);
			const totalExact = counted <= TABLE_ROW_LIMIT;
			// An estimate below what was already counted would read as a mistake.
			const total = totalExact ? counted : Math.max(counted, await repository.estimate(where));
			return {
				plants: rows.map((r) => plantTableItem(r, day)),
				page: query.page,
				perPage: query.perPage,
				total,
				totalExact,
				pages: Math.max(1, Math.ceil(Math.min(total, TABLE_ROW_LIMIT) / query.perPage))
			};
		},

		/** Every matching plant as CSV cells, batch by batch: the header and then the rows. */
		async export(filters: PlantTableFilters, viewer: Viewer) {
			const day = await today();
			const where = await whereFor(filters, viewer, day);
			async function* batches() {
				for await (const rows of repository.stream(where, filters)) {
					yield rows.map((r) => {
						const item = plantTableItem(r, day);
						return EXPORT_COLUMNS.map((c) => c.cell(item));
					});
				}
			}
			return { header: EXPORT_COLUMNS.map((c) => c.header), batches: batches(), day };
		},

		filterChoices: () => repository.filterChoices()
	};
}

export const plantTableService = makePlantTableService({ repository: plantTableRepository, today: nurseryToday });
