// The one catalogue service, against the database: several app instances, retired cultivars, own climates.
import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { catalogueRepository } from '../../../src/lib/server/catalogue/repository';
import { catalogueService, createCatalogueService } from '../../../src/lib/server/catalogue/service';
import { bumpCatalogueVersion } from '../../../src/lib/server/catalogue/version';
import { db } from '../../../src/lib/server/db';
import { climateProfiles, cultivars } from '../../../src/lib/server/db/schema';
import { plannerView } from '../../../src/lib/server/plan-preview';
import { GET as getCultivars } from '../../../src/routes/api/v1/cultivars/+server';
import { GET as getClimates } from '../../../src/routes/api/v1/climates/+server';
import { POST as postPreview } from '../../../src/routes/api/v1/plan-preview/+server';
import { call, postJson, validBody } from '../api/helpers';

const OWN_CLIMATE = {
	slug: 'marrowby-valley-test',
	name: 'Marrowby valley floor',
	monthlyMeanC: [19, 19.5, 21, 23, 25, 27, 28, 28, 27, 25, 22, 20],
	source: { kind: 'nursery' as const, note: 'our own thermometer, 2019–2025' }
};

afterAll(async () => {
	await db.update(cultivars).set({ retiredAt: null }).where(eq(cultivars.slug, 'saba'));
	await db.delete(climateProfiles).where(eq(climateProfiles.slug, OWN_CLIMATE.slug));
	await bumpCatalogueVersion(db);
});

describe('catalogue service', () => {
	it('another app instance sees a committed change on its next read, without a restart', async () => {
		const other = createCatalogueService(catalogueRepository);
		expect((await other.cultivars()).some((c) => c.cultivar.slug === 'saba')).toBe(true);
		await db.transaction(async (tx) => {
			await tx.update(cultivars).set({ retiredAt: new Date() }).where(eq(cultivars.slug, 'saba'));
			await bumpCatalogueVersion(tx);
		});
		expect((await other.cultivars()).some((c) => c.cultivar.slug === 'saba')).toBe(false);
		expect((await catalogueService.cultivars()).some((c) => c.cultivar.slug === 'saba')).toBe(false);
	});

	it('a retired cultivar is left out of the API list and the planner choices, but its plans still compute', async () => {
		const listed = (await (await call(getCultivars, '/api/v1/cultivars')).json()) as { cultivars: { slug: string }[] };
		expect(listed.cultivars.map((c) => c.slug)).not.toContain('saba');
		const res = await postJson(postPreview, '/api/v1/plan-preview', { ...validBody, cultivar: 'saba' });
		expect(res.status).toBe(200);
		const stored = await catalogueService.cultivarBySlug('saba');
		expect(stored?.retired).toBe(true);
		const view = plannerView(new URLSearchParams(), await catalogueService.snapshot(), '2026-05-04');
		expect(view.cultivarOptions.map((c) => c.slug)).not.toContain('saba');
		const shared = plannerView(new URLSearchParams('cultivar=saba&plantedOn=2026-03-01&ageAtPlantingWeeks=12&climate=south-florida-coast'), await catalogueService.snapshot(), '2026-05-04');
		expect(shared.errors).toEqual({});
		expect(shared.cultivarOptions.find((c) => c.slug === 'saba')?.name).toMatch(/no longer sold/);
	});

	it("the nursery's own climate is listed first by the API and the planner, and plans use its means", async () => {
		await db.transaction(async (tx) => {
			await tx.insert(climateProfiles).values({ ...OWN_CLIMATE, builtIn: false });
			await bumpCatalogueVersion(tx);
		});
		const body = (await (await call(getClimates, '/api/v1/climates')).json()) as { climates: { slug: string; source: { kind: string } }[] };
		// Every one of the nursery's own profiles (other test files may add theirs) comes before every built-in one.
		const kinds = body.climates.map((c) => c.source.kind);
		expect(kinds.lastIndexOf('nursery')).toBeLessThan(kinds.findIndex((k) => k !== 'nursery'));
		expect(body.climates.find((c) => c.slug === OWN_CLIMATE.slug)).toMatchObject({ source: { kind: 'nursery' } });
		const view = plannerView(new URLSearchParams(), await catalogueService.snapshot(), '2026-05-04');
		expect(view.climateOptions.slice(0, kinds.lastIndexOf('nursery') + 1)).toContainEqual({ slug: OWN_CLIMATE.slug, name: OWN_CLIMATE.name, nurserys: true });
		const own = await postJson(postPreview, '/api/v1/plan-preview', { ...validBody, climate: OWN_CLIMATE.slug });
		const same = await postJson(postPreview, '/api/v1/plan-preview', { ...validBody, climate: { monthlyMeanC: OWN_CLIMATE.monthlyMeanC } });
		expect(await own.json()).toEqual(await same.json());
	});
});
