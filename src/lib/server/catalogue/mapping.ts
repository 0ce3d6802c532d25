/**
 * Between the engine's catalogue shapes and the catalogue tables. Pure: no database.
 * A cultivar's plan parameters are every `{ value, source }` field of the engine's Cultivar, stored
 * by name in one jsonb column, so a parameter the engine adds later needs no migration.
 */
import { findCultivar, referenceCultivar, type ClimateProfile, type Cultivar, type CultivarGroup, type SizeClass, type Sourced } from '../../care';

export type CultivarParameters = Record<string, Sourced<number>>;

const isSourcedNumber = (v: unknown): v is Sourced<number> =>
	typeof v === 'object' && v !== null && 'value' in v && 'source' in v && typeof (v as Sourced<unknown>).value === 'number';

/** The engine's plan parameters of a cultivar, by name. */
export function parametersOf(cultivar: Cultivar): CultivarParameters {
	const out: CultivarParameters = {};
	for (const [key, value] of Object.entries(cultivar)) if (isSourcedNumber(value)) out[key] = value;
	return out;
}

/** Names of the plan parameters the engine reads, in the engine's order. */
export const cultivarParameterNames = (): string[] => Object.keys(parametersOf(referenceCultivar()));

export interface CultivarRowShape {
	slug: string;
	name: string;
	group: string;
	subgroup: string;
	size: string;
	notes: string;
	parameters: CultivarParameters;
}

export function cultivarToRow(c: Cultivar): CultivarRowShape {
	return { slug: c.slug, name: c.name, group: c.group, subgroup: c.subgroup, size: c.size, notes: c.notes ?? '', parameters: parametersOf(c) };
}

/**
 * A stored cultivar as the engine's input. A parameter missing from the row (added to the engine
 * after the row was written) falls back to the built-in cultivar of the same slug, then to the
 * reference cultivar, so every plan gets a full set.
 */
export function rowToCultivar(row: CultivarRowShape): Cultivar {
	const fallback = parametersOf(findCultivar(row.slug) ?? referenceCultivar());
	return {
		...(fallback as unknown as Cultivar),
		slug: row.slug,
		name: row.name,
		group: row.group as CultivarGroup,
		subgroup: row.subgroup,
		size: row.size as SizeClass,
		...(row.notes ? { notes: row.notes } : {}),
		...(row.parameters as unknown as Partial<Cultivar>)
	};
}

/**
 * Parameters of a built-in row after the engine's catalogue changed: values the nursery set itself
 * stay; every other value follows the engine (a recalibration reaches existing databases).
 */
export function mergeBuiltInParameters(stored: CultivarParameters, engine: CultivarParameters): CultivarParameters {
	const out: CultivarParameters = { ...engine };
	for (const [key, value] of Object.entries(stored)) if ((value.source as { kind: string }).kind === 'nursery') out[key] = value;
	return out;
}

export interface ClimateRowShape {
	slug: string;
	name: string;
	monthlyMeanC: number[];
	source: ClimateProfile['source'];
}

export const climateToRow = (c: ClimateProfile): ClimateRowShape => ({ slug: c.slug, name: c.name, monthlyMeanC: c.monthlyMeanC, source: c.source });
export const rowToClimate = (row: ClimateRowShape): ClimateProfile => ({ slug: row.slug, name: row.name, monthlyMeanC: row.monthlyMeanC, source: row.source });
