import { describe, expect, it } from 'vitest';
import { builtInSnapshot, versionedCache } from '$lib/server/catalogue/snapshot';
import { cultivars as engineCultivars, referenceClimateSlug } from '$lib/care';

function fakeStore() {
	const store = { version: 1, versionReads: 0, loads: 0 };
	const cache = versionedCache(
		async () => {
			store.versionReads++;
			return store.version;
		},
		async () => {
			store.loads++;
			return { version: store.version, loadedAs: store.loads };
		}
	);
	return { store, cache };
}

describe('versioned catalogue cache', () => {
	it('loads once per version and again when the version moves', async () => {
		const { store, cache } = fakeStore();
		expect((await cache.get()).loadedAs).toBe(1);
		expect((await cache.get()).loadedAs).toBe(1);
		expect(store.loads).toBe(1);
		store.version = 2;
		expect(await cache.get()).toEqual({ version: 2, loadedAs: 2 });
		expect(store.loads).toBe(2);
	});

	it('a burst of concurrent requests shares one version read and one load', async () => {
		const { store, cache } = fakeStore();
		const results = await Promise.all(Array.from({ length: 20 }, () => cache.get()));
		expect(new Set(results.map((r) => r.loadedAs))).toEqual(new Set([1]));
		expect(store.versionReads).toBe(1);
		expect(store.loads).toBe(1);
	});
});

describe('built-in snapshot', () => {
	it('offers every engine cultivar, finds each by slug and id, and feeds with the engine defaults when unconfigured', () => {
		const s = builtInSnapshot();
		expect(s.offeredCultivars).toHaveLength(engineCultivars.length);
		for (const c of engineCultivars) {
			const stored = s.cultivar(c.slug)!;
			expect(stored.cultivar).toEqual(c);
			expect(s.cultivarById(stored.id)).toBe(stored);
		}
		expect(s.settings.configured).toBe(false);
		expect(s.climate(referenceClimateSlug)?.nurserys).toBe(false);
	});

	it("feeds plans with the nursery's scoop, analysis and rules once configured", () => {
		const s = builtInSnapshot({ npk: [10, 5, 20], fullRationG: 500, handfulG: 80, restrictedMonths: [6, 7], nitrogenCapKgPer100m2: 0.5 });
		expect(s.feeding).toMatchObject({ npk: [10, 5, 20], fullRationG: 500, handfulG: 80, restrictedMonths: [6, 7], nitrogenCapKgPer100m2: 0.5 });
	});
});
