/**
 * Bounds of what the owner may set in the catalogue and the nursery settings: every cultivar plan
 * parameter and every feeding setting, with where each bound comes from. The zod schemas in
 * $lib/schema/catalogue and the owner's forms derive from these; a value outside them is refused
 * with a 400 naming the field. Every combination of extremes still gives a plan
 * (tests/unit/care/catalogue-bounds.test.ts).
 */
import type { Cultivar, CultivarGroup, SizeClass } from '../types';

export interface ParameterBound {
	min: number;
	max: number;
	/** Whole numbers only. */
	integer: boolean;
	/** Unit as shown beside the input. */
	unit: string;
	label: string;
	/** Where the bound comes from. */
	source: string;
}

/** Names of the cultivar fields that are plan parameters (each a `Sourced<number>`). */
export type CultivarParameterName = {
	[K in keyof Cultivar]-?: Cultivar[K] extends { value: number } ? K : never;
}[keyof Cultivar];

export const CULTIVAR_PARAMETER_BOUNDS: Record<CultivarParameterName, ParameterBound> = {
	matureHeightM: {
		min: 1,
		max: 9,
		integer: false,
		unit: 'm',
		label: 'Height at flowering',
		source: 'from memory: the smallest dwarf selections flower at about 1 m, the tallest cultivated bananas reach 8–9 m'
	},
	coldDamageC: {
		min: 4,
		max: 16,
		integer: false,
		unit: '°C',
		label: 'Leaves damaged below (monthly mean)',
		source:
			'from memory: chilling injury of Cavendish leaves and fruit below about 13 °C (Robinson J.C. & Galán Saúco V., Bananas and Plantains, 2nd ed., 2010, as recalled); hardy ABB types stand several degrees less'
	},
	leavesToShooting: {
		min: 25,
		max: 70,
		integer: true,
		unit: 'leaves',
		label: 'Leaves to shooting',
		source: 'from memory: about 30–45 leaves from sucker to flag leaf in plantains and small AA types, up to about 60 in tall triploids'
	},
	degreeDaysShootingToHarvest: {
		min: 800,
		max: 1300,
		integer: true,
		unit: '°C·d',
		label: 'Thermal time, shooting to harvest',
		source:
			'about −20 % to +35 % around the published 970 °C·d of Grand Nain (Umber M. et al. 2011, Scientia Horticulturae 129:52–57, as recalled); wider values are typing slips (from memory)'
	},
	leafRateFactor: {
		min: 0.5,
		max: 1.5,
		integer: false,
		unit: '× reference',
		label: 'Leaf rate (reference cultivar = 1)',
		source: 'from memory: plantains put out leaves about a quarter slower than Cavendish; half or one and a half times the reference is outside what growers report'
	},
	bunchMassKg: {
		min: 1,
		max: 80,
		integer: false,
		unit: 'kg',
		label: 'Bunch mass at harvest',
		source: 'from memory: small AA types give bunches of a few kilograms; exceptional Cavendish and Saba bunches pass 50 kg'
	}
};

export const CULTIVAR_PARAMETER_NAMES = Object.keys(CULTIVAR_PARAMETER_BOUNDS) as CultivarParameterName[];

/** Genome groups of cultivated bananas (A: Musa acuminata, B: M. balbisiana); `other` for the rest. */
export const CULTIVAR_GROUPS = ['AA', 'AAA', 'AAB', 'ABB', 'AAAA', 'AAAB', 'AABB', 'BB', 'other'] as const satisfies readonly CultivarGroup[];
export const SIZE_CLASSES = ['dwarf', 'medium', 'tall'] as const satisfies readonly SizeClass[];

// Compile-time check that the lists above name every member of the engine's types.
type Missing<All, Listed> = Exclude<All, Listed> extends never ? true : false;
const groupsComplete: Missing<CultivarGroup, (typeof CULTIVAR_GROUPS)[number]> = true;
const sizesComplete: Missing<SizeClass, (typeof SIZE_CLASSES)[number]> = true;
void groupsComplete;
void sizesComplete;

type FeedingBoundName = 'npkEach' | 'fullRationG' | 'handfulG' | 'nitrogenCapKgPer100m2';

export const FEEDING_SETTING_BOUNDS: Record<FeedingBoundName, ParameterBound> & { npkTotalMax: number } = {
	npkEach: {
		min: 0,
		max: 62,
		integer: false,
		unit: '%',
		label: 'N-P-K analysis',
		source: 'from memory: the richest common straight fertilizers are urea at 46 % N, monopotassium phosphate at 52 % P2O5 and muriate of potash at 60–62 % K2O'
	},
	/** The engine refuses an analysis adding up to more than 100 % (nutrients.ts `validateNpk`). */
	npkTotalMax: 100,
	fullRationG: {
		min: 100,
		max: 3000,
		integer: false,
		unit: 'g',
		label: 'Full ration (one level scoop)',
		source: "from memory: a mat's monthly ration is around the 2-lb (907 g) can the engine assumes; under 100 g or over 3 kg is a typing slip"
	},
	handfulG: {
		min: 20,
		max: 300,
		integer: false,
		unit: 'g',
		label: 'One handful',
		source: "from memory: a gardener's handful of granules weighs about 100 g"
	},
	nitrogenCapKgPer100m2: {
		min: 0.05,
		max: 2,
		integer: false,
		unit: 'kg N per 100 m²',
		label: 'Nitrogen cap per application',
		source: 'from memory: urban fertilizer ordinances in Florida allow at most 1 lb N per 1000 ft² (about 0.49 kg per 100 m²) per application'
	}
};

