import { describe, expect, it } from 'vitest';
import { climates, cultivars, findClimate, findCultivar, referenceClimateSlug } from '../../../src/lib/care/catalogue';
import type { Sourced } from '../../../src/lib/care/types';

const kebab = /^[a-z0-9]+(-[a-z0-9]+)*$/;

describe('catalogue', () => {
	it('has at least 12 cultivars of several groups and sizes, unique kebab-case slugs', () => {
		expect(cultivars.length).toBeGreaterThanOrEqual(12);
		expect(new Set(cultivars.map((c) => c.group)).size).toBeGreaterThanOrEqual(5);
		expect(new Set(cultivars.map((c) => c.size))).toEqual(new Set(['dwarf', 'medium', 'tall']));
		expect(new Set(cultivars.map((c) => c.slug)).size).toBe(cultivars.length);
		for (const c of cultivars) expect(c.slug).toMatch(kebab);
	});
	it('every parameter has a provenance and a plausible value', () => {
		for (const c of cultivars) {
			const params: Sourced<number>[] = [c.matureHeightM, c.coldDamageC, c.leavesToShooting, c.degreeDaysShootingToHarvest, c.leafRateFactor, c.bunchMassKg];
			for (const p of params) {
				expect(['published', 'common-practice', 'from-memory']).toContain(p.source.kind);
				expect(p.value).toBeGreaterThan(0);
			}
			expect(c.degreeDaysShootingToHarvest.value).toBeGreaterThanOrEqual(800);
			expect(c.degreeDaysShootingToHarvest.value).toBeLessThanOrEqual(1300);
		}
	});
	it('Grand Nain: 970 °C·d flowering to harvest, published (Umber et al. 2011)', () => {
		const gn = findCultivar('grand-nain')!;
		expect(gn.degreeDaysShootingToHarvest.value).toBe(970);
		expect(gn.degreeDaysShootingToHarvest.source).toMatchObject({ kind: 'published' });
	});
	it('has at least 4 climates of 12 monthly means with a source, and the reference among them', () => {
		expect(climates.length).toBeGreaterThanOrEqual(4);
		for (const c of climates) {
			expect(c.monthlyMeanC).toHaveLength(12);
			expect(c.slug).toMatch(kebab);
			expect(c.source.kind).toBeDefined();
		}
		expect(findClimate(referenceClimateSlug)).toBeDefined();
		expect(findClimate('nowhere')).toBeUndefined();
	});
});
