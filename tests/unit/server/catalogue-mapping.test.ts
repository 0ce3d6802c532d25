import { describe, expect, it } from 'vitest';
import { cultivars, findCultivar, referenceCultivar } from '$lib/care';
import { cultivarToRow, mergeBuiltInParameters, parametersOf, rowToCultivar } from '$lib/server/catalogue/mapping';

describe('catalogue rows and the engine', () => {
	it('every built-in cultivar survives the trip through a row unchanged', () => {
		for (const c of cultivars) expect(rowToCultivar(cultivarToRow(c))).toEqual(c);
	});

	it('stores every numeric parameter with its source and nothing else', () => {
		const params = parametersOf(referenceCultivar());
		expect(Object.keys(params)).toContain('leavesToShooting');
		expect(Object.keys(params)).not.toContain('name');
		for (const p of Object.values(params)) expect(p.source.kind).toBeTruthy();
	});

	it('a parameter missing from an old row falls back to the built-in value of the same cultivar', () => {
		const c = findCultivar('grand-nain')!;
		const row = cultivarToRow(c);
		delete row.parameters.bunchMassKg;
		expect(rowToCultivar(row).bunchMassKg).toEqual(c.bunchMassKg);
	});

	it("a recalibrated engine value replaces the stored one, the nursery's own value stays", () => {
		const stored = {
			leavesToShooting: { value: 40, source: { kind: 'nursery' } },
			bunchMassKg: { value: 20, source: { kind: 'from-memory' } }
		} as never;
		const engine = {
			leavesToShooting: { value: 55, source: { kind: 'common-practice' } },
			bunchMassKg: { value: 25, source: { kind: 'from-memory' } }
		} as never;
		const merged = mergeBuiltInParameters(stored, engine);
		expect(merged.leavesToShooting!.value).toBe(40);
		expect(merged.bunchMassKg!.value).toBe(25);
	});
});
