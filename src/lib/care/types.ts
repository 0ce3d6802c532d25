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

export type Units = 'metric' | 'imperial';

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

export interface Observed {
	/** Leaves counted on the mother, with the day they were counted. */
	leafCount?: { on: IsoDate; leaves: number };
	followersOn?: IsoDate;
	shotOn?: IsoDate;
	harvestedOn?: IsoDate;
}

export interface PlanInput {
	cultivar: Cultivar;
	plantedOn: IsoDate;
	ageAtPlantingWeeks: number;
	climate: { monthlyMeanC: number[] };
	units?: Units;
	feeding?: FeedingSettings;
	observed?: Observed;
	/** How many generations to plan (mother = 0). At least 3. */
	generations?: number;
}

export type StepKind =
	| 'planting'
	| 'feeding'
	| 'followers'
	| 'thinning'
	| 'division'
	| 'flag-leaf'
	| 'shooting'
	| 'bud-removal'
	| 'harvest'
	| 'ripening'
	| 'cut-back'
	| 'stem-removal';

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
}
