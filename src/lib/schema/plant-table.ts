/**
 * The nursery's table of plants: filters, sorting and paging. One definition, read by the page's
 * URL, GET /api/v1/plants and GET /api/v1/plants.csv, so a bookmarked view, the JSON and the
 * exported file always agree on what "these plants" means.
 */
import { z } from 'zod';
import { PLANT_STAGES, type PlantStage } from '$lib/care';

/** The engine's stage vocabulary (one source); the table filters on the stage kept on each plant row. */
export const TABLE_STAGES = PLANT_STAGES.map((s) => s.id) as [PlantStage, ...PlantStage[]];
export const STAGE_CHOICES: readonly { stage: PlantStage; label: string }[] = PLANT_STAGES.map((s) => ({ stage: s.id, label: s.label }));
export const stageLabel = (stage: string | null): string => PLANT_STAGES.find((s) => s.id === stage)?.label ?? 'Not planted yet';

/** Columns the table sorts by; each has an index (see plants in src/lib/server/db/schema). */
export const PLANT_SORTS = ['nextStep', 'soldOn', 'age', 'lastMilestone'] as const;
export type PlantSort = (typeof PLANT_SORTS)[number];
export const SORT_LABELS: Record<PlantSort, string> = {
	nextStep: 'Next step',
	soldOn: 'Sold on',
	age: 'Age',
	lastMilestone: 'Last milestone'
};

export const ORDERS = ['asc', 'desc'] as const;
export type SortOrder = (typeof ORDERS)[number];

export const PER_PAGE_MIN = 10;
export const PER_PAGE_MAX = 100;
export const PER_PAGE_DEFAULT = 25;
export const PER_PAGE_CHOICES = [10, 25, 50, 100] as const;

/**
 * The table pages through the first 10,000 matching plants, and counts exactly up to there;
 * beyond that the count is the database planner's estimate. Offsets deeper than this cost a scan
 * of every row skipped; narrower filters (or the CSV export, which has no limit) reach the rest.
 */
export const TABLE_ROW_LIMIT = 10_000;

/** Query-string booleans, spelled the way a URL reads. */
export const YES_NO = ['yes', 'no'] as const;

/** An empty form field means "any", not a bad value. */
const blankToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);
const optional = <T extends z.ZodType>(schema: T) => z.preprocess(blankToUndefined, schema.optional());

const wholeNumber = (message: string, min: number, max: number) =>
	z.coerce.number({ error: message }).int(message).min(min, message).max(max, message);

export const plantTableQuerySchema = z
	.object({
		cultivar: optional(
			z
				.string()
				.trim()
				.max(80, 'A cultivar slug has at most 80 characters')
				.regex(/^[a-z0-9-]+$/, 'Choose a cultivar by its slug, as listed by GET /api/v1/cultivars')
		),
		stage: optional(z.enum(TABLE_STAGES, { error: `Choose a stage: ${TABLE_STAGES.join(', ')}` })),
		market: optional(wholeNumber('Choose a market day by its number', 1, 2_147_483_647)),
		claimed: optional(z.enum(YES_NO, { error: 'Claimed is yes or no' })),
		overdue: optional(z.enum(YES_NO, { error: 'Overdue is yes or no' })),
		sort: z.preprocess(blankToUndefined, z.enum(PLANT_SORTS, { error: `Sort by one of: ${PLANT_SORTS.join(', ')}` }).default('nextStep')),
		order: z.preprocess(blankToUndefined, z.enum(ORDERS, { error: 'Order is asc or desc' }).default('asc')),
		page: z.preprocess(blankToUndefined, wholeNumber('Page is a whole number from 1', 1, TABLE_ROW_LIMIT).default(1)),
		perPage: z.preprocess(
			blankToUndefined,
			wholeNumber(`Show ${PER_PAGE_MIN} to ${PER_PAGE_MAX} plants a page`, PER_PAGE_MIN, PER_PAGE_MAX).default(PER_PAGE_DEFAULT)
		)
	})
	.superRefine((q, ctx) => {
		if ((q.page - 1) * q.perPage >= TABLE_ROW_LIMIT) {
			ctx.addIssue({
				code: 'custom',
				path: ['page'],
				message: `The table pages through the first ${TABLE_ROW_LIMIT.toLocaleString('en')} plants: narrow the filters, or export the CSV for all of them`
			});
		}
	});

export type PlantTableQuery = z.infer<typeof plantTableQuerySchema>;
export type PlantTableFilters = Pick<PlantTableQuery, 'cultivar' | 'stage' | 'market' | 'claimed' | 'overdue' | 'sort' | 'order'>;

export const FILTER_KEYS = ['cultivar', 'stage', 'market', 'claimed', 'overdue'] as const;
const QUERY_KEYS = [...FILTER_KEYS, 'sort', 'order', 'page', 'perPage'] as const;

/** The query string's fields as a plain object; unknown parameters are ignored, the first of a repeated one wins. */
export function queryObject(params: URLSearchParams): Record<string, string> {
	const out: Record<string, string> = {};
	for (const key of QUERY_KEYS) {
		const value = params.get(key);
		if (value !== null) out[key] = value;
	}
	return out;
}

export function parsePlantTableQuery(params: URLSearchParams) {
	return plantTableQuerySchema.safeParse(queryObject(params));
}

const DEFAULTS: Partial<Record<(typeof QUERY_KEYS)[number], string>> = {
	sort: 'nextStep',
	order: 'asc',
	page: '1',
	perPage: String(PER_PAGE_DEFAULT)
};

/**
 * The shortest query string for a view: defaults and empty filters are left out, keys in one
 * order, so the same view always has the same URL (bookmarks, the back button, caches).
 */
export function plantTableSearch(values: Partial<Record<(typeof QUERY_KEYS)[number], string | number | undefined>>, keys: readonly string[] = QUERY_KEYS): string {
	const params = new URLSearchParams();
	for (const key of QUERY_KEYS) {
		if (!keys.includes(key)) continue;
		const value = values[key];
		if (value === undefined || value === '' || String(value) === DEFAULTS[key]) continue;
		params.set(key, String(value));
	}
	const s = params.toString();
	return s ? `?${s}` : '';
}

/** The same filters and sort without paging: what the CSV export of a view is asked for. */
export const exportSearch = (values: Parameters<typeof plantTableSearch>[0]) =>
	plantTableSearch(values, [...FILTER_KEYS, 'sort', 'order']);
