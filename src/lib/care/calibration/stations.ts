/**
 * Weather stations whose monthly mean temperatures stand for the places of the calibration anchors
 * (anchors.ts). Each is a long-term normal of a national weather service, January first, °C
 * (mean of the daily maximum and minimum, rounded to 0.1 °C).
 *
 * Honesty note: the stored public pages searched for this work held only one of these services'
 * normals tables in full (Santa Cruz de Tenerife, through a copy of an encyclopaedia table that
 * names AEMET as its source); every other row is recalled and marked `from memory`. Where a stored
 * page confirms part of a row, `checkedAgainst` says which page and what it confirms.
 */
import { referenceClimate } from '../catalogue/climates';

export interface Station {
	slug: string;
	/** The station as its weather service names it, and the place it stands for. */
	name: string;
	/** Whose normal, over which period. */
	normal: string;
	monthlyMeanC: readonly number[];
	fromMemory: boolean;
	checkedAgainst?: string;
}

export const stations: readonly Station[] = [
	{
		slug: 'innisfail',
		name: 'Innisfail, Queensland (Bureau of Meteorology station 032025), for the Innisfail–Tully banana coast',
		normal: 'Bureau of Meteorology climate statistics, all years of record',
		monthlyMeanC: [26.8, 26.9, 26.0, 24.3, 22.2, 20.0, 19.2, 19.9, 21.7, 23.6, 25.4, 26.5], // from memory
		fromMemory: true
	},
	{
		slug: 'honolulu',
		name: 'Honolulu International Airport, Hawaiʻi (NOAA), for the Honolulu lowlands',
		normal: 'NOAA U.S. Climate Normals 1991–2020',
		monthlyMeanC: [22.9, 22.8, 23.4, 24.2, 25.3, 26.6, 27.2, 27.6, 27.3, 26.6, 25.2, 23.9], // from memory
		fromMemory: true
	},
	{
		slug: 'abidjan',
		name: 'Abidjan Port-Bouët airport, Côte d’Ivoire (SODEXAM), for Aboisso, about 100 km east on the same coast',
		normal: 'WMO climatological normals 1961–1990',
		monthlyMeanC: [27.0, 27.8, 27.9, 27.8, 27.1, 25.9, 25.0, 24.7, 25.2, 26.2, 26.9, 26.8], // from memory
		fromMemory: true
	},
	{
		slug: 'alstonville',
		name: 'Alstonville Tropical Fruit Research Station, New South Wales (Bureau of Meteorology station 058131)',
		normal: 'Bureau of Meteorology climate statistics, all years of record',
		monthlyMeanC: [23.1, 23.0, 22.0, 19.8, 17.0, 14.7, 13.8, 14.8, 17.0, 19.0, 20.8, 22.3], // from memory
		fromMemory: true,
		checkedAgainst: 'annual mean 18.9 °C, against the "about 19 °C" of the calibration issue (Turner 1972 describes the site)'
	},
	{
		slug: 'santa-cruz-de-tenerife',
		name: 'Santa Cruz de Tenerife, Canary Islands (AEMET), for open-air plantations on the coast',
		normal:
			'AEMET normals as tabulated in “Santa Cruz de Tenerife – Climate” (liquisearch.com copy of the encyclopaedia section, table “Climate data for Santa Cruz”, source given as Agencia Estatal de Meteorología; period not stated, the values fit 1971–2000)',
		monthlyMeanC: [17.9, 18.0, 18.7, 19.2, 20.6, 22.4, 24.6, 25.1, 24.6, 23.0, 21.0, 19.0],
		fromMemory: false,
		checkedAgainst: 'thetenerifeweather.com (stored page): the AEMET observatory’s annual mean 21.5 °C and about 18.3 °C in January, probably the later 1981–2010 normal, 0.3 °C warmer'
	},
	{
		slug: 'st-petersburg-fl',
		name: 'St. Petersburg Albert Whitted, Florida (NOAA), for Pinellas County',
		normal: 'NOAA U.S. Climate Normals 1991–2020',
		monthlyMeanC: [17.1, 18.3, 20.3, 22.8, 26.0, 28.2, 29.0, 29.1, 28.3, 25.3, 21.4, 18.4], // from memory
		fromMemory: true,
		checkedAgainst: 'NWS Tampa Bay monthly climate report for St. Petersburg, December 2023 (stored page): December normal mean 65.1 °F = 18.4 °C'
	},
	{
		slug: 'miami',
		name: 'Miami, Florida (NOAA): the engine’s reference climate, a warm subtropical coast',
		normal: 'long-term NOAA normals, as in the engine’s climate catalogue',
		monthlyMeanC: referenceClimate().monthlyMeanC, // from memory (the catalogue's reference climate)
		fromMemory: true
	}
];

export function station(slug: string): Station {
	const found = stations.find((s) => s.slug === slug);
	if (!found) throw new Error(`No calibration station ${slug}`);
	return found;
}
