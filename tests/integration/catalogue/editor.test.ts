// The owner's edits against the database: history, retiring, the nursery's climates and the settings every plan reads.
import { afterAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { findCultivar } from '../../../src/lib/care';
import { cultivarToRow } from '../../../src/lib/server/catalogue/mapping';
import { cultivarFormValues } from '../../../src/lib/catalogue/changes';
import { cultivarFormSchema, settingsFormSchema, climateFormSchema } from '../../../src/lib/schema/catalogue';
import { catalogueEditor } from '../../../src/lib/server/catalogue/editor';
import { catalogueService } from '../../../src/lib/server/catalogue/service';
import { bumpCatalogueVersion } from '../../../src/lib/server/catalogue/version';
import { db } from '../../../src/lib/server/db';
import { climateProfiles, cultivarChanges, cultivars, nurserySettings, plants } from '../../../src/lib/server/db/schema';
import { UserFacingError } from '../../../src/lib/server/errors';
import { POST as postPreview } from '../../../src/routes/api/v1/plan-preview/+server';
import { insertGardener, insertPlant } from '../../helpers/plants';
import { postJson, validBody } from '../api/helpers';
import { SETTINGS_FIELDS, WARM_MEANS } from '../../helpers/catalogue';

async function formFor(slug: string, overrides: Record<string, string>) {
	const stored = (await catalogueService.cultivarBySlug(slug))!;
	return cultivarFormSchema.parse({ ...cultivarFormValues({ ...cultivarToRow(stored.cultivar), usualPriceCents: stored.usualPriceCents }), ...overrides });
}

async function refusal(p: Promise<unknown>): Promise<UserFacingError> {
	const e = await p.then(
		() => undefined,
		(err: unknown) => err
	);
	if (!(e instanceof UserFacingError)) throw new Error(`expected a refusal, got ${String(e)}`);
	return e;
}

const means = WARM_MEANS;
const settingsForm = (overrides: Record<string, unknown> = {}) =>
	settingsFormSchema.parse({
		...SETTINGS_FIELDS,
		timeZone: 'Pacific/Auckland',
		fertilizerName: 'Test mix',
		npkN: '10',
		npkP: '5',
		npkK: '20',
		fullRationG: '500',
		handfulG: '50',
		restrictedMonths: ['7', '6'],
		...overrides
	});

afterAll(async () => {
	await db.delete(nurserySettings);
	await bumpCatalogueVersion(db);
});

describe('editing a cultivar', () => {
	it('records who changed which field from what to what, and new plans use the new value at once', async () => {
		const owner = await insertGardener('Wren Owner', 'owner');
		const before = (await postJson(postPreview, '/api/v1/plan-preview', { ...validBody, cultivar: 'williams' }).then((r) => r.json())) as { steps: { kind: string; likely: string }[] };
		const changed = await catalogueEditor.editCultivar('williams', await formFor('williams', { leavesToShooting: '40', sourceNote: 'our 2024 trial' }), owner.id);
		expect(changed).toBe(1);
		const stored = (await catalogueService.cultivarBySlug('williams'))!;
		expect(stored.cultivar.leavesToShooting).toEqual({ value: 40, source: { kind: 'nursery', note: 'our 2024 trial' } });
		const history = await catalogueEditor.history(stored.id, 1, 25);
		expect(history.rows[0]).toMatchObject({ field: 'leavesToShooting', by: 'Wren Owner', oldValue: { value: 56 }, newValue: { value: 40, source: { kind: 'nursery' } } });
		const after = (await postJson(postPreview, '/api/v1/plan-preview', { ...validBody, cultivar: 'williams' }).then((r) => r.json())) as typeof before;
		const shot = (p: typeof before) => p.steps.find((s) => s.kind === 'shooting')!.likely;
		// Fewer leaves to emit: the stem shoots earlier.
		expect(shot(after) < shot(before)).toBe(true);
	});

	it('an unknown cultivar is a 404 and writes nothing', async () => {
		const count = async () => (await db.select({ n: sql<number>`count(*)::int` }).from(cultivarChanges))[0]!.n;
		const n = await count();
		expect((await refusal(catalogueEditor.editCultivar('no-such-banana', await formFor('williams', {}), 1))).status).toBe(404);
		expect(await count()).toBe(n);
	});

	it("adds the nursery's own cultivar with every parameter its own, under a fresh slug", async () => {
		const owner = await insertGardener('Wren Owner', 'owner');
		const form = await formFor('grand-nain', { name: 'Grand Nain', subgroup: 'Cavendish' });
		const slug = await catalogueEditor.addCultivar(form, owner.id);
		expect(slug).toBe('grand-nain-2');
		const added = (await catalogueService.cultivarBySlug(slug))!;
		expect(added.builtIn).toBe(false);
		expect(added.cultivar.leavesToShooting.source.kind).toBe('nursery');
		expect((await catalogueEditor.history(added.id, 1, 25)).rows.map((r) => r.field)).toEqual(['created']);
	});
});

describe('retiring a cultivar', () => {
	it('takes it off sale, keeps the plants already sold and their plans, records it, and restores it', async () => {
		const owner = await insertGardener('Wren Owner', 'owner');
		const gardener = await insertGardener();
		const plant = await insertPlant({ gardenerId: gardener.id, cultivar: 'mysore' });
		expect(await catalogueEditor.setRetired('mysore', true, owner.id)).toBe(true);
		expect(await catalogueEditor.setRetired('mysore', true, owner.id)).toBe(false);
		expect((await catalogueService.cultivars()).map((c) => c.cultivar.slug)).not.toContain('mysore');
		const stored = (await catalogueService.cultivarBySlug('mysore'))!;
		expect(stored.retired).toBe(true);
		expect((await db.select().from(plants).where(eq(plants.id, plant.id)))[0]!.cultivarId).toBe(stored.id);
		expect(await catalogueEditor.plantsOfCultivar(stored.id)).toBeGreaterThanOrEqual(1);
		expect((await postJson(postPreview, '/api/v1/plan-preview', { ...validBody, cultivar: 'mysore' })).status).toBe(200);
		await catalogueEditor.setRetired('mysore', false, owner.id);
		expect((await catalogueService.cultivars()).map((c) => c.cultivar.slug)).toContain('mysore');
		const fields = (await catalogueEditor.history(stored.id, 1, 25)).rows.map((r) => [r.field, r.newValue]);
		expect(fields.slice(0, 2)).toEqual([
			['retired', false],
			['retired', true]
		]);
	});
});

describe("the nursery's climates and settings", () => {
	it('a climate in use or the default cannot be deleted; an unused one can', async () => {
		const owner = await insertGardener('Wren Owner', 'owner');
		const used = await catalogueEditor.addClimate(climateFormSchema.parse({ name: 'Marrowby hillside', monthlyMeanC: means, sourceNote: 'hill station 2015–2025' }), owner.id);
		const gardener = await insertGardener();
		await insertPlant({ gardenerId: gardener.id, climate: used });
		const inUse = await refusal(catalogueEditor.deleteClimate(used));
		expect([inUse.status, inUse.message]).toEqual([409, expect.stringMatching(/1 plant grows in this climate/)]);

		const spare = await catalogueEditor.addClimate(climateFormSchema.parse({ name: 'Marrowby quay', monthlyMeanC: means, sourceNote: 'quay station' }), owner.id);
		await catalogueEditor.saveSettings(settingsForm({ defaultClimate: spare }));
		expect((await refusal(catalogueEditor.deleteClimate(spare))).message).toMatch(/default climate/);
		expect((await refusal(catalogueEditor.addClimate(climateFormSchema.parse({ name: 'Marrowby quay', monthlyMeanC: means, sourceNote: 'x' }), owner.id))).field).toBe('name');

		await catalogueEditor.saveSettings(settingsForm());
		await catalogueEditor.deleteClimate(spare);
		expect(await db.select().from(climateProfiles).where(eq(climateProfiles.slug, spare))).toEqual([]);
		expect((await refusal(catalogueEditor.deleteClimate('south-florida-coast'))).status).toBe(403);
	});

	it("saved settings feed every plan: the scoop, the analysis, the restricted months and the time zone", async () => {
		await catalogueEditor.saveSettings(settingsForm());
		const context = await catalogueService.planningContext();
		expect(context).toEqual({ timeZone: 'Pacific/Auckland', feeding: expect.objectContaining({ npk: [10, 5, 20], fullRationG: 500, handfulG: 50, restrictedMonths: [6, 7] }) });
		const { steps } = (await postJson(postPreview, '/api/v1/plan-preview', validBody).then((r) => r.json())) as { steps: { kind: string; amount?: { value: number } }[] };
		const amounts = new Set(steps.filter((s) => s.kind === 'feeding').map((s) => s.amount!.value));
		expect(amounts.has(500)).toBe(true);
		expect(amounts.has(50)).toBe(true);
		expect((await refusal(catalogueEditor.saveSettings(settingsForm({ defaultClimate: 'atlantis' })))).field).toBe('defaultClimate');
	});
});

afterAll(async () => {
	// Leave the built-in catalogue as the engine ships it for the test files that run after this one.
	await db.update(cultivars).set({ retiredAt: null }).where(eq(cultivars.slug, 'mysore'));
	await db.update(cultivars).set({ parameters: cultivarToRow(findCultivar('williams')!).parameters }).where(eq(cultivars.slug, 'williams'));
	await db.delete(cultivars).where(eq(cultivars.slug, 'grand-nain-2'));
	await bumpCatalogueVersion(db);
});
