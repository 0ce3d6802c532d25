/**
 * The catalogue as every plan reads it: cultivars, climate profiles and the nursery's feeding
 * settings, mapped to the engine's shapes once per catalogue version. Pure: built from rows.
 */
import {
	climates as engineClimates,
	cultivars as engineCultivars,
	defaultFeeding,
	referenceClimateSlug,
	referenceCultivarSlug,
	type ClimateProfile,
	type Cultivar,
	type FeedingSettings,
	type Units
} from '../../care';
import type { CatalogueRows, ClimateRow, CultivarRow, SettingsRow } from './repository';
import { climateToRow, cultivarToRow, rowToClimate, rowToCultivar } from './mapping';

export interface StoredCultivar {
	id: number;
	cultivar: Cultivar;
	usualPriceCents: number | null;
	builtIn: boolean;
	/** Retired from sale: readable for plants already sold, not offered for new plans. */
	retired: boolean;
}

export interface StoredClimate {
	id: number;
	climate: ClimateProfile;
	/** The nursery's own profile (listed first to buyers, who mostly garden near the nursery). */
	nurserys: boolean;
}

/** What the nursery settings hold, or what a nursery not yet set up gets. */
export interface NurserySettings {
	configured: boolean;
	name: string;
	town: string;
	market: string;
	units: Units;
	timeZone: string;
	/** Slug of a climate profile. */
	defaultClimate: string;
	fertilizerName: string;
	npk: [number, number, number];
	fullRationG: number;
	handfulG: number;
	restrictedMonths: number[];
	nitrogenCapKgPer100m2: number | null;
}

export interface CatalogueSnapshot {
	version: number;
	/** Every cultivar, retired ones included, by name. */
	cultivars: StoredCultivar[];
	/** Cultivars offered for new plans (planner, stall): not retired. */
	offeredCultivars: StoredCultivar[];
	/** The nursery's own profiles first, then the built-in ones, each by name. */
	climates: StoredClimate[];
	settings: NurserySettings;
	/** The fertilizer, scoop and local rules every plan is fed with. */
	feeding: FeedingSettings;
	cultivar(slug: string): StoredCultivar | undefined;
	cultivarById(id: number): StoredCultivar | undefined;
	climate(slug: string): StoredClimate | undefined;
	climateById(id: number): StoredClimate | undefined;
}

export const toStoredCultivar = (r: CultivarRow): StoredCultivar => ({
	id: r.id,
	cultivar: rowToCultivar(r),
	usualPriceCents: r.usualPriceCents,
	builtIn: r.builtIn,
	retired: r.retiredAt !== null
});

export const toStoredClimate = (r: ClimateRow): StoredClimate => ({ id: r.id, climate: rowToClimate(r), nurserys: !r.builtIn });

/** Shown before the owner has set the nursery up: the engine's defaults and a neutral name. */
export const UNCONFIGURED_SETTINGS: NurserySettings = {
	configured: false,
	name: 'Your nursery',
	town: 'your town',
	market: 'the market',
	units: 'metric',
	timeZone: 'UTC',
	defaultClimate: referenceClimateSlug,
	fertilizerName: `Balanced banana fertilizer ${defaultFeeding.npk.join('-')}`,
	npk: defaultFeeding.npk,
	fullRationG: defaultFeeding.fullRationG,
	handfulG: defaultFeeding.handfulG,
	restrictedMonths: defaultFeeding.restrictedMonths,
	nitrogenCapKgPer100m2: null
};

export function toSettings(row: SettingsRow | undefined): NurserySettings {
	if (!row) return UNCONFIGURED_SETTINGS;
	return {
		configured: true,
		name: row.name,
		town: row.town,
		market: row.market,
		units: row.units,
		timeZone: row.timeZone,
		defaultClimate: row.defaultClimate,
		fertilizerName: row.fertilizerName,
		npk: row.npk,
		fullRationG: row.fullRationG,
		handfulG: row.handfulG,
		restrictedMonths: row.restrictedMonths,
		nitrogenCapKgPer100m2: row.nitrogenCapKgPer100m2
	};
}

export function feedingOf(s: NurserySettings): FeedingSettings {
	return {
		...defaultFeeding,
		npk: s.npk,
		fullRationG: s.fullRationG,
		handfulG: s.handfulG,
		restrictedMonths: s.restrictedMonths,
		...(s.nitrogenCapKgPer100m2 != null ? { nitrogenCapKgPer100m2: s.nitrogenCapKgPer100m2 } : {})
	};
}

export function buildSnapshot(rows: CatalogueRows): CatalogueSnapshot {
	const cultivars = rows.cultivars.map(toStoredCultivar);
	const climates = rows.climates.map(toStoredClimate);
	const settings = toSettings(rows.settings);
	const bySlug = new Map(cultivars.map((c) => [c.cultivar.slug, c]));
	const byId = new Map(cultivars.map((c) => [c.id, c]));
	const climateBySlug = new Map(climates.map((c) => [c.climate.slug, c]));
	const climateById = new Map(climates.map((c) => [c.id, c]));
	return {
		version: rows.version,
		cultivars,
		offeredCultivars: cultivars.filter((c) => !c.retired),
		climates,
		settings,
		feeding: feedingOf(settings),
		cultivar: (slug) => bySlug.get(slug),
		cultivarById: (id) => byId.get(id),
		climate: (slug) => climateBySlug.get(slug),
		climateById: (id) => climateById.get(id)
	};
}

/** The cultivar a new plan starts from: the reference cultivar while it is offered, else the first offered. */
export function defaultCultivarSlug(s: CatalogueSnapshot): string | undefined {
	return (s.offeredCultivars.find((c) => c.cultivar.slug === referenceCultivarSlug) ?? s.offeredCultivars[0])?.cultivar.slug;
}

/** The climate a new plan starts from: the nursery's default while it exists, else the reference climate. */
export function defaultClimateSlug(s: CatalogueSnapshot): string {
	return s.climate(s.settings.defaultClimate) ? s.settings.defaultClimate : referenceClimateSlug;
}

/**
 * Keeps the last value and re-loads it only when the version moved. Concurrent callers share one
 * version read, so a burst of requests costs one small query. The version is read again on every
 * call (no lifetime): an edit on one app instance is seen by the next request on any other.
 */
export function versionedCache<T extends { version: number }>(readVersion: () => Promise<number>, load: () => Promise<T>) {
	let cached: T | undefined;
	let pending: Promise<T> | undefined;
	async function refresh(): Promise<T> {
		const version = await readVersion();
		if (cached && cached.version === version) return cached;
		const fresh = await load();
		// A slower, older load never replaces a newer one.
		if (!cached || fresh.version >= cached.version) cached = fresh;
		return cached;
	}
	return {
		get(): Promise<T> {
			pending ??= refresh().finally(() => {
				pending = undefined;
			});
			return pending;
		}
	};
}

/**
 * The engine's built-in catalogue as a snapshot, without a database: for unit tests and tools.
 * Ids follow the engine's order; `settings` overrides the unconfigured defaults.
 */
export function builtInSnapshot(settings?: Partial<NurserySettings>): CatalogueSnapshot {
	const at = new Date(0);
	return buildSnapshot({
		version: 0,
		cultivars: [...engineCultivars]
			.sort((a, b) => a.name.localeCompare(b.name))
			.map((c, i) => ({ id: i + 1, ...cultivarToRow(c), usualPriceCents: null, builtIn: true, retiredAt: null, createdAt: at, updatedAt: at })),
		climates: engineClimates.map((c, i) => ({ id: i + 1, ...climateToRow(c), builtIn: true, createdBy: null, createdAt: at, updatedAt: at })),
		settings: settings ? { id: 1, ...UNCONFIGURED_SETTINGS, ...settings, demo: false, updatedAt: at } : undefined
	});
}
