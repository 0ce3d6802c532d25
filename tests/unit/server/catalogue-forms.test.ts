// The owner's forms: bounds from the engine, refusals named by field, and what an edit records.
import { describe, expect, it } from 'vitest';
import { CULTIVAR_PARAMETER_BOUNDS, referenceCultivar } from '$lib/care';
import { applyCultivarEdit, cultivarFormValues, slugify, valueText, type EditableCultivar } from '$lib/catalogue/changes';
import { climateFormSchema, cultivarFormSchema, settingsFormSchema } from '$lib/schema/catalogue';
import { fieldErrors } from '$lib/schema/form';
import { cultivarToRow } from '$lib/server/catalogue/mapping';
import { SETTINGS_FIELDS, WARM_MEANS } from '../../helpers/catalogue';

const stored: EditableCultivar = { ...cultivarToRow(referenceCultivar()), usualPriceCents: 1250 };
const validCultivar = () => cultivarFormValues(stored);
const errorsOf = (schema: { safeParse: (v: unknown) => { success: boolean; error?: unknown } }, value: unknown) => {
	const r = schema.safeParse(value);
	return r.success ? {} : fieldErrors(r.error as never);
};

const validSettings = { ...SETTINGS_FIELDS, timeZone: 'Europe/Lisbon', restrictedMonths: ['6', '7'] };

describe('cultivar form', () => {
	it('accepts the stored values of a built-in cultivar as they are shown', () => {
		const r = cultivarFormSchema.safeParse(validCultivar());
		expect(r.success).toBe(true);
		expect(r.data).toMatchObject({ leavesToShooting: 55, usualPrice: 12.5, sourceNote: '' });
	});

	it('names each field refused: empty, too long, out of bounds, text in a number, fractional leaves', () => {
		const b = CULTIVAR_PARAMETER_BOUNDS;
		const errors = errorsOf(cultivarFormSchema, {
			...validCultivar(),
			name: '',
			subgroup: 'x'.repeat(61),
			group: 'ZZZ',
			leavesToShooting: String(b.leavesToShooting.max + 1),
			bunchMassKg: 'heavy',
			degreeDaysShootingToHarvest: String(b.degreeDaysShootingToHarvest.min - 1),
			leafRateFactor: '',
			matureHeightM: '3',
			coldDamageC: '12.5',
			usualPrice: '-1'
		});
		expect(Object.keys(errors).sort()).toEqual(['bunchMassKg', 'degreeDaysShootingToHarvest', 'group', 'leafRateFactor', 'leavesToShooting', 'name', 'subgroup', 'usualPrice'].sort());
		expect(errors.leavesToShooting).toBe(`Enter a whole number from ${b.leavesToShooting.min} to ${b.leavesToShooting.max} leaves`);
		expect(errorsOf(cultivarFormSchema, { ...validCultivar(), leavesToShooting: '40.5' })).toHaveProperty('leavesToShooting');
		expect(errorsOf(cultivarFormSchema, { ...validCultivar(), usualPrice: '3.999' })).toHaveProperty('usualPrice');
	});
});

describe('an edit of a cultivar', () => {
	it("records each changed field once, and a changed parameter becomes the nursery's own with the note", () => {
		const form = cultivarFormSchema.parse({ ...validCultivar(), name: 'Grand Nain (our line)', leavesToShooting: '50', sourceNote: 'our records 2020–2025' });
		const { next, changes } = applyCultivarEdit(stored, form as never);
		expect(changes.map((c) => c.field)).toEqual(['name', 'leavesToShooting']);
		expect(changes[1]).toEqual({ field: 'leavesToShooting', oldValue: stored.parameters.leavesToShooting, newValue: { value: 50, source: { kind: 'nursery', note: 'our records 2020–2025' } } });
		// Untouched parameters keep their published or recalled source.
		expect(next.parameters.degreeDaysShootingToHarvest).toEqual(stored.parameters.degreeDaysShootingToHarvest);
		expect(next.parameters.leavesToShooting.source.kind).toBe('nursery');
	});

	it('saving the form unchanged records nothing', () => {
		expect(applyCultivarEdit(stored, cultivarFormSchema.parse(validCultivar()) as never).changes).toEqual([]);
	});

	it('prices are kept in cents and shown back in the currency', () => {
		const { changes } = applyCultivarEdit(stored, cultivarFormSchema.parse({ ...validCultivar(), usualPrice: '14.9' }) as never);
		expect(changes).toEqual([{ field: 'usualPriceCents', oldValue: 1250, newValue: 1490 }]);
		expect(valueText('usualPriceCents', 1490)).toBe('14.90');
	});

	it('slugs are plain lowercase words', () => {
		expect(slugify('Kestrel Red №2 — Dwarf!')).toBe('kestrel-red-no2-dwarf');
		expect(slugify('Ñame Blanco')).toBe('name-blanco');
		expect(slugify('***')).toBe('cultivar');
	});
});

describe('climate form', () => {
	const means = WARM_MEANS;
	it('reads twelve inputs and needs a source note', () => {
		expect(climateFormSchema.safeParse({ name: 'Valley', monthlyMeanC: means, sourceNote: 'station, 1991–2020' }).success).toBe(true);
		expect(Object.keys(errorsOf(climateFormSchema, { name: 'Valley', monthlyMeanC: means, sourceNote: '' }))).toEqual(['sourceNote']);
	});
	it('names the month with text, and refuses a year too cool to fruit', () => {
		expect(errorsOf(climateFormSchema, { name: 'V', monthlyMeanC: [...means.slice(0, 3), 'warm', ...means.slice(4)], sourceNote: 's' })).toHaveProperty(['monthlyMeanC.3']);
		expect(errorsOf(climateFormSchema, { name: 'V', monthlyMeanC: Array(12).fill('9'), sourceNote: 's' })).toHaveProperty('monthlyMeanC');
	});
});

describe('settings form', () => {
	it('accepts the settings and reads restricted months and a blank cap', () => {
		const r = settingsFormSchema.parse(validSettings);
		expect(r).toMatchObject({ npkN: 8, restrictedMonths: [6, 7], nitrogenCapKgPer100m2: undefined });
	});
	it('refuses a zone not in the IANA list, an analysis over 100 %, a handful over the ration, text in a number', () => {
		expect(Object.keys(errorsOf(settingsFormSchema, { ...validSettings, timeZone: 'Mars/Olympus', nitrogenCapKgPer100m2: 'lots' })).sort()).toEqual(['nitrogenCapKgPer100m2', 'timeZone']);
		// The checks across fields run once each field is valid on its own.
		expect(Object.keys(errorsOf(settingsFormSchema, { ...validSettings, npkN: '46', npkP: '30', npkK: '30', handfulG: '300', fullRationG: '200' })).sort()).toEqual(['handfulG', 'npkK']);
		expect(errorsOf(settingsFormSchema, { ...validSettings, restrictedMonths: ['13'] })).toHaveProperty(['restrictedMonths.0']);
		expect(errorsOf(settingsFormSchema, { ...validSettings, name: 'x'.repeat(81) }).name).toMatch(/at most 80/);
	});
});
