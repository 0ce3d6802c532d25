/**
 * Cultivar parameters. Most values are recalled and marked `from-memory`; the leaf count of the
 * reference cultivar is the trade's rule of thumb (`common practice, no source`), and the Grand
 * Nain flowering-to-harvest thermal time is published. The recalled flowering-to-harvest thermal
 * times are kept within 900–1035 °C·d, about 7 % either side of Cavendish, so every cultivar stays
 * within 85–124 days in the humid tropics, around the 108 days Lassoudière & Maubert (1971)
 * report for Cavendish (tests/unit/care/trade.test.ts checks it for all of them).
 */
import type { Cultivar, CultivarGroup, Provenance, SizeClass, Sourced } from '../types';

export const referenceCultivarSlug = 'grand-nain';

const recalled: Provenance = { kind: 'from-memory' };
const trade: Provenance = { kind: 'common-practice' };
const umber2011: Provenance = {
	kind: 'published',
	citation:
		'Umber M. et al. 2011, Scientia Horticulturae 129:52–57: flowering to harvest of Grand Nain in thermal time, 970 °C·d above 13.9 °C (citation as recalled); base temperature after Jullien, Chillet & Malézieux 2001'
};

function recall<T>(value: T): Sourced<T> {
	return { value, source: recalled };
}

interface Row {
	slug: string;
	name: string;
	group: CultivarGroup;
	subgroup: string;
	size: SizeClass;
	heightM: number;
	coldC: number;
	leaves: number;
	degreeDays: number;
	leafRate: number;
	bunchKg: number;
	notes?: string;
}

function cultivar(row: Row): Cultivar {
	return {
		slug: row.slug,
		name: row.name,
		group: row.group,
		subgroup: row.subgroup,
		size: row.size,
		matureHeightM: recall(row.heightM),
		coldDamageC: recall(row.coldC),
		leavesToShooting: recall(row.leaves),
		degreeDaysShootingToHarvest: recall(row.degreeDays),
		leafRateFactor: recall(row.leafRate),
		bunchMassKg: recall(row.bunchKg),
		...(row.notes ? { notes: row.notes } : {})
	};
}

const grandNain: Cultivar = {
	...cultivar({ slug: 'grand-nain', name: 'Grand Nain', group: 'AAA', subgroup: 'Cavendish', size: 'medium', heightM: 2.7, coldC: 12, leaves: 55, degreeDays: 970, leafRate: 1, bunchKg: 30 }),
	leavesToShooting: { value: 55, source: trade },
	degreeDaysShootingToHarvest: { value: 970, source: umber2011 },
	leafRateFactor: { value: 1, source: { kind: 'from-memory', note: 'reference cultivar of the leaf-rate calibration' } },
	notes: 'The reference cultivar: leaf rate and harvest timing are calibrated on it.'
};

export const cultivars: Cultivar[] = [
	cultivar({ slug: 'dwarf-cavendish', name: 'Dwarf Cavendish', group: 'AAA', subgroup: 'Cavendish', size: 'dwarf', heightM: 2.0, coldC: 12, leaves: 50, degreeDays: 950, leafRate: 1, bunchKg: 18 }),
	grandNain,
	cultivar({ slug: 'williams', name: 'Williams', group: 'AAA', subgroup: 'Cavendish', size: 'medium', heightM: 3.2, coldC: 12, leaves: 56, degreeDays: 980, leafRate: 1, bunchKg: 30 }),
	cultivar({ slug: 'gros-michel', name: 'Gros Michel', group: 'AAA', subgroup: 'Gros Michel', size: 'tall', heightM: 6.0, coldC: 13, leaves: 60, degreeDays: 1000, leafRate: 0.95, bunchKg: 30, notes: 'Very susceptible to Fusarium wilt race 1.' }),
	cultivar({ slug: 'red-dacca', name: 'Red Dacca', group: 'AAA', subgroup: 'Red', size: 'tall', heightM: 5.0, coldC: 13, leaves: 60, degreeDays: 1030, leafRate: 0.85, bunchKg: 20 }),
	cultivar({ slug: 'sucrier', name: 'Sucrier (Sugar, Lady Finger in the Americas)', group: 'AA', subgroup: 'Sucrier', size: 'medium', heightM: 3.0, coldC: 13, leaves: 50, degreeDays: 900, leafRate: 0.95, bunchKg: 12 }),
	cultivar({ slug: 'ice-cream', name: 'Ice Cream (Blue Java)', group: 'ABB', subgroup: 'Ney Mannan', size: 'tall', heightM: 4.5, coldC: 10, leaves: 58, degreeDays: 1035, leafRate: 0.95, bunchKg: 20 }),
	cultivar({ slug: 'mysore', name: 'Mysore', group: 'AAB', subgroup: 'Mysore', size: 'tall', heightM: 4.5, coldC: 11, leaves: 58, degreeDays: 1020, leafRate: 0.95, bunchKg: 22 }),
	cultivar({ slug: 'silk', name: 'Silk (Manzano)', group: 'AAB', subgroup: 'Silk', size: 'tall', heightM: 4.0, coldC: 12, leaves: 56, degreeDays: 1020, leafRate: 0.95, bunchKg: 15 }),
	cultivar({ slug: 'dwarf-brazilian', name: 'Dwarf Brazilian (Dwarf Pome)', group: 'AAB', subgroup: 'Pome', size: 'medium', heightM: 3.5, coldC: 11, leaves: 54, degreeDays: 1000, leafRate: 0.95, bunchKg: 16 }),
	cultivar({ slug: 'goldfinger', name: 'Goldfinger (FHIA-01)', group: 'AAAB', subgroup: 'FHIA hybrid', size: 'medium', heightM: 3.5, coldC: 10, leaves: 55, degreeDays: 1020, leafRate: 1, bunchKg: 28 }),
	cultivar({ slug: 'horn-plantain', name: 'Horn plantain', group: 'AAB', subgroup: 'Plantain', size: 'tall', heightM: 4.0, coldC: 13, leaves: 38, degreeDays: 1030, leafRate: 0.72, bunchKg: 15, notes: 'Few hands and no male bud left at maturity.' }),
	cultivar({ slug: 'french-plantain', name: 'French plantain', group: 'AAB', subgroup: 'Plantain', size: 'tall', heightM: 3.5, coldC: 13, leaves: 42, degreeDays: 1030, leafRate: 0.75, bunchKg: 20 }),
	cultivar({ slug: 'saba', name: 'Saba', group: 'ABB', subgroup: 'Saba', size: 'tall', heightM: 5.5, coldC: 10, leaves: 60, degreeDays: 1035, leafRate: 0.95, bunchKg: 30 }),
	cultivar({ slug: 'dwarf-orinoco', name: 'Dwarf Orinoco (Bluggoe type)', group: 'ABB', subgroup: 'Bluggoe', size: 'medium', heightM: 3.0, coldC: 10, leaves: 55, degreeDays: 1030, leafRate: 0.95, bunchKg: 20 }),
	cultivar({ slug: 'namwa', name: 'Namwa (Pisang Awak)', group: 'ABB', subgroup: 'Pisang Awak', size: 'tall', heightM: 5.0, coldC: 10, leaves: 58, degreeDays: 1020, leafRate: 0.95, bunchKg: 25 }),
	cultivar({ slug: 'pisang-raja', name: 'Pisang Raja', group: 'AAB', subgroup: 'Pisang Raja', size: 'tall', heightM: 4.0, coldC: 12, leaves: 56, degreeDays: 1020, leafRate: 0.95, bunchKg: 20 })
];

export function findCultivar(slug: string): Cultivar | undefined {
	return cultivars.find((c) => c.slug === slug);
}

export function referenceCultivar(): Cultivar {
	const found = findCultivar(referenceCultivarSlug);
	if (!found) throw new Error(`Reference cultivar ${referenceCultivarSlug} missing from the catalogue`);
	return found;
}
