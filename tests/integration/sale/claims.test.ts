import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { computePlan, findClimate, findCultivar } from '../../../src/lib/care';
import { STAGE_OF_STEP } from '../../../src/lib/care';
import { db } from '../../../src/lib/server/db';
import { plants, signInAttempts, waitlistEntries } from '../../../src/lib/server/db/schema';
import { claimService, salesService, stockService, waitlistService } from '../../../src/lib/server/sale-side';
import { claimLimitKey, CLAIM_LIMIT } from '../../../src/lib/server/plants/claim';
import { GET as getPlants } from '../../../src/routes/api/v1/plants/+server';
import { GET as getPlant } from '../../../src/routes/api/v1/plants/[id]/+server';
import { linkIn, waitForAll, waitForMail } from '../../helpers/mail';
import { batchOf, callAs, daysAgo, newClientId, person, refusal, refusedFields, saleCounts, today, type Person } from './helpers';

let owner: Person;
let staff: Person;
let pim: Person;
let sol: Person;
let ipCounter = 0;
const nextIp = () => `10.88.${Math.floor(++ipCounter / 250)}.${ipCounter % 250}`;

beforeAll(async () => {
	[owner, staff, pim, sol] = await Promise.all([person('owner'), person('staff'), person('gardener'), person('gardener')]);
});

async function soldPlants(quantity = 1) {
	const batch = await batchOf(quantity, owner);
	const { sale, plants: sold } = await salesService.record({ batchId: batch.id, quantity, pricePerPlant: 15, clientId: newClientId() }, staff.id, today());
	return { sale, codes: sold.map((p) => p.claimLink.split('/claim/')[1]), ids: sold.map((p) => p.id) };
}

const claimInput = (extra: Record<string, unknown> = {}) => ({ plantedOn: today(), climate: 'south-florida-coast', units: 'metric' as const, ...extra });


describe('claiming a plant', () => {
	it('a code claims its plant once; the plant then belongs to that gardener', async () => {
		const { codes, ids } = await soldPlants();
		const shown = await claimService.lookup(codes[0], nextIp(), pim.id);
		expect(shown.cultivarName).toBe('Grand Nain');
		expect(shown.defaultPlantedOn > shown.soldOn).toBe(true);
		await claimService.claim(codes[0], pim.id, claimInput(), nextIp(), today());
		const [row] = await db.select().from(plants).where(eq(plants.id, ids[0]));
		expect(row).toMatchObject({ gardenerId: pim.id, plantedOn: today(), units: 'metric' });
		// Sold at 12 weeks and planted the same day.
		expect(row.ageAtPlantingWeeks).toBe(12);
		const used = await refusal(claimService.claim(codes[0], sol.id, claimInput(), nextIp(), today()));
		expect(used.status).toBe(410);
		expect((await refusal(claimService.lookup(codes[0], nextIp(), sol.id))).status).toBe(410);
		expect((await db.select().from(plants).where(eq(plants.id, ids[0])))[0].gardenerId).toBe(pim.id);
	});

	it('an unknown or malformed code is 404', async () => {
		expect((await refusal(claimService.lookup('a'.repeat(32), nextIp(), null))).status).toBe(404);
		expect((await refusal(claimService.lookup('../../etc', nextIp(), null))).status).toBe(404);
	});

	const badClaims: [string, Record<string, unknown>, string][] = [
		['a planting date before the sale', { plantedOn: daysAgo(30) }, 'plantedOn'],
		['a planting date far in the future', { plantedOn: '2999-06-01' }, 'plantedOn'],
		['an unknown climate', { climate: 'atlantis' }, 'climate']
	];
	for (const [what, extra, field] of badClaims) {
		it(`refuses ${what} naming ${field}, writing nothing`, async () => {
			const { codes } = await soldPlants();
			const before = await saleCounts();
			const e = await refusal(claimService.claim(codes[0], pim.id, claimInput(extra) as never, nextIp(), today()));
			expect(e.field).toBe(field);
			expect(e.status).toBe(400);
			expect(await saleCounts()).toEqual(before);
		});
	}

	it('takes twelve monthly means of the gardener’s own', async () => {
		const { codes, ids } = await soldPlants();
		const means = findClimate('south-florida-coast')!.monthlyMeanC;
		await claimService.claim(codes[0], sol.id, claimInput({ climate: 'custom', monthlyMeanC: means }) as never, nextIp(), today());
		const [row] = await db.select().from(plants).where(eq(plants.id, ids[0]));
		expect(row.customMonthlyMeanC).toEqual(means);
		expect(row.climateProfileId).toBeNull();
	});

	it('reissuing retires the old code (404) and the new one claims', async () => {
		const { sale, codes } = await soldPlants(2);
		const fresh = await salesService.reissue(sale.id);
		const newCodes = fresh.map((p) => p.claimLink.split('/claim/')[1]);
		expect(newCodes).not.toContain(codes[0]);
		expect((await refusal(claimService.lookup(codes[0], nextIp(), null))).status).toBe(404);
		await claimService.claim(newCodes[0], pim.id, claimInput(), nextIp(), today());
	});

	it('limits claim attempts per address like sign-in', async () => {
		const ip = '10.99.1.1';
		await db.delete(signInAttempts).where(eq(signInAttempts.key, claimLimitKey(ip)));
		for (let i = 0; i < CLAIM_LIMIT.limit; i++) await refusal(claimService.lookup('b'.repeat(32), ip, null));
		const { codes } = await soldPlants();
		expect((await refusal(claimService.lookup(codes[0], ip, null))).status).toBe(429);
		expect((await claimService.lookup(codes[0], nextIp(), null)).cultivarName).toBe('Grand Nain');
	});
});

describe('GET /api/v1/plants', () => {
	it('a gardener sees their own plants; staff see every plant; each plant has its stage and next step', async () => {
		const { codes, ids } = await soldPlants(2);
		await claimService.claim(codes[0], pim.id, claimInput({ plantedOn: today() }), nextIp(), today());
		const res = await callAs(getPlants, pim, '/api/v1/plants?perPage=100');
		expect(res.status).toBe(200);
		const body = (await res.json()) as { plants: { id: number }[]; total: number };
		expect(body.plants.map((p) => p.id)).toContain(ids[0]);
		expect(body.plants.map((p) => p.id)).not.toContain(ids[1]);
		const one = await callAs(getPlant, pim, `/api/v1/plants/${ids[0]}`, { params: { id: String(ids[0]) } });
		const mine = ((await one.json()) as { plant: { nextStep: { kind: string; on: string } | null; stage: { id: string } | null } }).plant;
		// The stage stored with the plan the claim wrote: planted today, so at the planting stage.
		expect(mine.stage?.id).toBe(STAGE_OF_STEP.planting);
		// The next step is the engine's first step from today on, for the same inputs.
		const plan = computePlan({ cultivar: findCultivar('grand-nain')!, plantedOn: today(), ageAtPlantingWeeks: 12, climate: { monthlyMeanC: findClimate('south-florida-coast')!.monthlyMeanC } });
		expect(mine.nextStep).toMatchObject({ kind: plan.steps[0].kind, on: plan.steps[0].likely });
		const all = (await (await callAs(getPlants, staff, '/api/v1/plants?perPage=100')).json()) as { total: number };
		expect(all.total).toBeGreaterThan(body.total);
	});

	it('another gardener’s plant is 404, by id, exactly like a missing one', async () => {
		const { codes, ids } = await soldPlants();
		await claimService.claim(codes[0], pim.id, claimInput(), nextIp(), today());
		const own = await callAs(getPlant, pim, `/api/v1/plants/${ids[0]}`, { params: { id: String(ids[0]) } });
		expect(own.status).toBe(200);
		const other = await callAs(getPlant, sol, `/api/v1/plants/${ids[0]}`, { params: { id: String(ids[0]) } });
		expect(await refusedFields(other, 404)).toEqual(['id']);
		const missing = await callAs(getPlant, sol, '/api/v1/plants/99999999', { params: { id: '99999999' } });
		expect(await refusedFields(missing, 404)).toEqual(['id']);
		expect((await callAs(getPlants, null, '/api/v1/plants')).status).toBe(401);
	});
});

describe('the waitlist', () => {
	it('each waiting address gets one e-mail when stock arrives, and leaves in one click', async () => {
		const cultivar = 'dwarf-cavendish';
		// Sell out whatever earlier tests left of it.
		const { batches } = await stockService.page(100, 0, today());
		for (const b of batches.filter((b) => b.cultivar.slug === cultivar)) await stockService.adjust({ batchId: b.id, change: -b.onHand, reason: 'test sell-out' }, staff.id, today());
		const email = `waiting.${Date.now()}@example.test`;
		const inStock = async () => false;
		await waitlistService.join({ cultivar, email }, inStock);
		await stockService.receive({ cultivar, count: 4, pottedOn: daysAgo(50), location: undefined }, owner.id, today());
		const mail = await waitForMail(email, 'back in stock');
		await stockService.receive({ cultivar, count: 2, pottedOn: daysAgo(51), location: undefined }, owner.id, today());
		await new Promise((r) => setTimeout(r, 500));
		expect(await waitForAll(email, 'back in stock', 2, 500)).toHaveLength(1);
		const token = linkIn(mail).searchParams.get('token')!;
		expect((await waitlistService.entry(token))?.email).toBe(email);
		await waitlistService.leave(token);
		expect(await db.select().from(waitlistEntries).where(eq(waitlistEntries.email, email))).toHaveLength(0);
		expect((await refusal(waitlistService.leave(token))).status).toBe(410);
	});

	it('refuses joining for a cultivar that is in stock or unknown', async () => {
		expect((await refusal(waitlistService.join({ cultivar: 'grand-nain', email: 'x@example.test' }, async () => true))).status).toBe(409);
		expect((await refusal(waitlistService.join({ cultivar: 'no-such', email: 'x@example.test' }, async () => false))).field).toBe('cultivar');
	});
});
