import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { climates, cultivars } from '../../../src/lib/care';
import { catalogueService } from '../../../src/lib/server/catalogue/service';
import { syncBuiltInCatalogue } from '../../../src/lib/server/catalogue/sync';
import { bumpCatalogueVersion } from '../../../src/lib/server/catalogue/version';
import { db } from '../../../src/lib/server/db';
import { cultivars as cultivarTable } from '../../../src/lib/server/db/schema';

describe('built-in catalogue in the database', () => {
	it('the migrated database holds every engine cultivar and climate, read back in the engine shape', async () => {
		const stored = await catalogueService.cultivars(true);
		for (const c of cultivars) expect(stored.find((s) => s.cultivar.slug === c.slug)?.cultivar).toEqual(c);
		const storedClimates = await catalogueService.climates();
		for (const c of climates) expect(storedClimates.find((s) => s.climate.slug === c.slug)?.climate).toEqual(c);
	});

	it("syncing again keeps the nursery's own parameter value and restores a drifted built-in one", async () => {
		const row = (await db.select().from(cultivarTable).where(eq(cultivarTable.slug, 'williams')))[0]!;
		const own = { value: 50, source: { kind: 'nursery' } };
		const drifted = { value: 1, source: { kind: 'from-memory' } };
		await db
			.update(cultivarTable)
			.set({ parameters: { ...row.parameters, leavesToShooting: own, bunchMassKg: drifted } as never })
			.where(eq(cultivarTable.id, row.id));
		await syncBuiltInCatalogue(db);
		const after = (await catalogueService.cultivarBySlug('williams'))!.cultivar;
		expect(after.leavesToShooting).toEqual(own);
		expect(after.bunchMassKg).toEqual(cultivars.find((c) => c.slug === 'williams')!.bunchMassKg);
		await db.update(cultivarTable).set({ parameters: row.parameters }).where(eq(cultivarTable.id, row.id));
		await bumpCatalogueVersion(db);
	});
});
