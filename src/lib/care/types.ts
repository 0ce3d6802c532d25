import type { StepKind, Units } from './vocabulary';

export type { StepKind, Units };

/**
 * Shared shapes of the care-plan engine. Pure data: no database, no SvelteKit.
 * Dates are ISO calendar dates (YYYY-MM-DD) in the garden's local calendar.
 */

export type IsoDate = string;

/**
 * Where a value came from: a published source, the trade's rule of thumb, recall, or the nursery's
 * own value (set by the owner in the catalogue, from their own records; kept across engine updates).
 */
export type Provenance =
	| { kind: 'published'; citation: string }
	| { kind: 'common-practice' } // `common practice, no source`
	| { kind: 'from-memory'; note?: string }
	| { kind: 'nursery'; note?: string };

export interface Sourced<T> {
	value: T;
	source: Provenance;
}

export type CultivarGroup = 'AA' | 'AAA' | 'AAB' | 'ABB' | 'AAAA' | 'AAAB' | 'AABB' | 'BB' | 'other';
export type SizeClass = 'dwarf' | 'medium' | 'tall';

export interface Cultivar {
	slug: string;
	name: string;
	group: CultivarGroup;
	/** Subgroup or type, e.g. 'Cavendish', 'Plantain', 'Pome'. */
	subgroup: string;
	size: SizeClass;
	matureHeightM: Sourced<number>;
	/** Mean monthly temperature (°C) below which leaves are damaged; informative. */
	coldDamageC: Sourced<number>;
	/** Leaves a plant emits from sucker/plantlet to shooting (including the flag leaf). */
	leavesToShooting: Sourced<number>;
	/** Degree-days above the base temperature from shooting to the harvest window opening. */
	degreeDaysShootingToHarvest: Sourced<number>;
	/** Scales the leaf emission rate relative to the reference cultivar (1 = reference). */
	leafRateFactor: Sourced<number>;
	/** Typical bunch mass at harvest, kg. */
	bunchMassKg: Sourced<number>;
	notes?: string;
}

export interface ClimateProfile {
	slug: string;
	name: string;
	/** Twelve monthly mean air temperatures, January first, °C. */
	monthlyMeanC: number[];
	source: Provenance;
}

export interface FeedingSettings {
	/** N-P-K analysis as printed on the bag: % N, % P2O5, % K2O. */
	npk: [number, number, number];
	/** Mass of one level "can" (the nursery's scoop), grams; the plan's full ration. */
	fullRationG: number;
	/** Mass of one handful, grams. */
	handfulG: number;
	/** Months (1-12) in which local rules restrict nitrogen or phosphorus. */
	restrictedMonths: number[];
	/** Optional cap: kg of N per 100 m² per application. */
	nitrogenCapKgPer100m2?: number;
	/** Area the mat's feeding is spread over, m² (used only with the cap). */
	matFootprintM2?: number;
}

/**
 * Milestones the gardener logged for one stem. Each replaces its forecast and re-times every
 * step that depends on it.
 */
export interface Observed {
	/** Leaves counted on the stem, with the day they were counted. */
	leafCount?: { on: IsoDate; leaves: number };
	/** The day this stem's own suckers (the next generation) were first seen. */
	followersOn?: IsoDate;
	/** The short last leaf before the flower. */
	flagLeafOn?: IsoDate;
	shotOn?: IsoDate;
	harvestedOn?: IsoDate;
	cutBackOn?: IsoDate;
	stemRemovedOn?: IsoDate;
	/** The stem died or was removed early: its later steps are dropped; its follower takes over. */
	lostOn?: IsoDate;
}

export interface PlanInput {
	cultivar: Cultivar;
	plantedOn: IsoDate;
	ageAtPlantingWeeks: number;
	climate: { monthlyMeanC: number[] };
	units?: Units;
	feeding?: FeedingSettings;
	/** Milestones of generation 0, the plant sold. */
	observed?: Observed;
	/** Milestones of the followers: index 0 is generation 1 (follower 1), and so on. */
	observedFollowers?: Observed[];
	/** How many generations to plan (mother = 0). At least 3. */
	generations?: number;
}

export interface Amount {
	value: number;
	unit: 'g' | 'kg' | 'oz' | 'lb';
	/** Kitchen measure, e.g. "1 handful", "½ can (2-lb)". */
	measure?: string;
}

export interface Nutrients {
	/** Elemental N, P and K supplied by this application, in the amount's unit. */
	n: number;
	p: number;
	k: number;
	unit: 'g' | 'oz';
}

export interface Step {
	kind: StepKind;
	title: string;
	/** Plain explanation of what to do and why. */
	detail: string;
	earliest: IsoDate;
	likely: IsoDate;
	latest: IsoDate;
	/** 0 = the plant as sold, 1 = its first follower, … */
	generation: number;
	/** True when the date comes from a logged milestone rather than a forecast. */
	observed?: boolean;
	amount?: Amount;
	nutrients?: Nutrients;
	cautions?: string[];
	/** Slug of the guide that explains this step. */
	guide?: string;
	/** Set on feedings in a month when local rules restrict N or P: the gardener chooses. */
	restricted?: { reason: string; skippable: true };
}

export interface Plan {
	steps: Step[];
	/** Stems logged as lost, with the day; their later steps are left out of `steps`. */
	lost?: { generation: number; on: IsoDate }[];
}
