/**
 * Climate profiles: 12 monthly mean air temperatures (°C, January first).
 * All values are recalled long-term normals, rounded to 0.1 °C, and marked `from memory`.
 */
import type { ClimateProfile } from '../types';

export const referenceClimateSlug = 'south-florida-coast';

export const climates: ClimateProfile[] = [
	{
		slug: 'south-florida-coast',
		name: 'Warm subtropical coast (south Florida, e.g. Miami)',
		monthlyMeanC: [20.1, 21.1, 22.6, 24.6, 26.5, 28.1, 28.7, 28.9, 28.3, 26.5, 23.7, 21.5],
		source: { kind: 'from-memory', note: 'Miami long-term monthly normals, recalled; the reference climate of the trade facts' }
	},
	{
		slug: 'canary-islands-coast',
		name: 'Mild subtropical island coast (Canary Islands)',
		monthlyMeanC: [18.2, 18.3, 18.9, 19.5, 20.6, 22.1, 23.6, 24.4, 24.2, 22.9, 21.0, 19.3],
		source: { kind: 'from-memory', note: 'Las Palmas / Santa Cruz coastal normals, recalled' }
	},
	{
		slug: 'northern-nsw-coast',
		name: 'Cool subtropical coast (northern New South Wales)',
		monthlyMeanC: [23.6, 23.6, 22.6, 20.3, 17.5, 14.9, 13.9, 14.8, 17.0, 18.9, 20.8, 22.5],
		source: { kind: 'from-memory', note: 'Coffs Harbour long-term normals, recalled' }
	},
	{
		slug: 'humid-tropical-lowland',
		name: 'Humid tropical lowland (e.g. Colombo)',
		monthlyMeanC: [26.6, 27.0, 27.8, 28.3, 28.4, 27.8, 27.5, 27.6, 27.5, 27.0, 26.7, 26.6],
		source: { kind: 'from-memory', note: 'Colombo long-term normals, recalled' }
	},
	{
		slug: 'southern-california-coast',
		name: 'Cool marginal subtropical coast (southern California, e.g. San Diego)',
		monthlyMeanC: [14.4, 14.8, 15.6, 16.7, 17.9, 19.2, 21.2, 22.1, 21.6, 19.7, 16.9, 14.3],
		source: { kind: 'from-memory', note: 'San Diego long-term normals, recalled' }
	}
];

export function findClimate(slug: string): ClimateProfile | undefined {
	return climates.find((c) => c.slug === slug);
}

export function referenceClimate(): ClimateProfile {
	const climate = findClimate(referenceClimateSlug);
	if (!climate) throw new Error(`Reference climate ${referenceClimateSlug} missing from the catalogue`);
	return climate;
}
