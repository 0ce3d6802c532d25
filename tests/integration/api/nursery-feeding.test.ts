// The public plan preview feeds with the nursery's own fertilizer and local rules.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../../src/lib/server/db';
import { nurserySettings } from '../../../src/lib/server/db/schema';
import { bumpCatalogueVersion } from '../../../src/lib/server/catalogue/version';
import { POST } from '../../../src/routes/api/v1/plan-preview/+server';
import { postJson, validBody } from './helpers';

beforeAll(async () => {
	await db.delete(nurserySettings);
	await db.insert(nurserySettings).values({
		id: 1,
		name: 'Test nursery',
		town: 'Testville',
		market: 'the test market',
		defaultClimate: 'south-florida-coast',
		fertilizerName: 'Test mix 10-5-20',
		npk: [10, 5, 20],
		// Several Florida counties ban N and P fertilizer June 1 to September 30 (common practice, no source).
		restrictedMonths: [6, 7, 8, 9]
	});
	await bumpCatalogueVersion(db);
});
afterAll(async () => {
	await db.delete(nurserySettings).where(eq(nurserySettings.id, 1));
	await bumpCatalogueVersion(db);
});

interface StepJson {
	kind: string;
	likely: string;
	amount?: { value: number; unit: string };
	nutrients?: { n: number; p: number; k: number };
	restricted?: { reason: string; skippable: boolean };
	cautions?: string[];
}

describe('plan preview with the nursery settings', () => {
	it('flags feedings in restricted months, keeps them, and computes nutrients from the nursery analysis', async () => {
		const res = await postJson(POST as never, '/api/v1/plan-preview', validBody);
		expect(res.status).toBe(200);
		const feedings = ((await res.json()).steps as StepJson[]).filter((s) => s.kind === 'feeding');
		const inSummer = feedings.filter((s) => [6, 7, 8, 9].includes(Number(s.likely.slice(5, 7))));
		expect(inSummer.length).toBeGreaterThan(0);
		for (const s of inSummer) {
			expect(s.restricted?.skippable).toBe(true);
			expect(s.amount!.value).toBeGreaterThan(0);
		}
		for (const s of feedings.filter((f) => !inSummer.includes(f))) expect(s.restricted).toBeUndefined();
		// 10-5-20: N is 10 % of the mass, P = 5 % × 0.4364, K = 20 % × 0.8301 (Virginia Tech SPES-201NP).
		const full = feedings.find((s) => s.amount!.unit === 'g' && s.amount!.value > 800)!;
		expect(full.nutrients!.n).toBeCloseTo(full.amount!.value * 0.1, 0);
		expect(full.nutrients!.p).toBeCloseTo(full.amount!.value * 0.05 * 0.4364, 0);
		expect(full.nutrients!.k).toBeCloseTo(full.amount!.value * 0.2 * 0.8301, 0);
	});
});
