// The demo's stock and sales, seeded once through the same services the app uses: batches at the
// nursery, a market day ten weeks ago whose plants the demo gardeners bought and claimed (one left
// unclaimed), and today's market day at the quay with a few sales, so every sale-side page has
// something to show on a fresh start. Dates are relative to the day of seeding.
import { and, count, eq, isNull } from 'drizzle-orm';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { formatIsoDate, parseIsoDate, referenceClimateSlug } from '../src/lib/care';
import { config } from '../src/lib/server/config';
import { climateProfiles, cultivars, stockBatches, users } from '../src/lib/server/db/schema';
import { createClaimService } from '../src/lib/server/plants/claim';
import { createSalesService } from '../src/lib/server/sales/service';
import { claimSecret } from '../src/lib/server/secrets';
import { createStockService } from '../src/lib/server/stock/service';
import { DEMO_ACCOUNTS, DEMO_NURSERY } from './demo.mjs';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyDb = PgDatabase<PgQueryResultHKT, any>;

const MARKET = 'Marrowby Quay Saturday Market';

/** Fixed client ids, so the demo's sales are the same rows on every machine. */
const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;

const daysFrom = (iso: string, days: number) => formatIsoDate(parseIsoDate(iso) + days);

/**
 * `storePlan` stores a claimed plant's plan, as a claim in the app does (src/lib/server/sale-side.ts),
 * so the demo gardeners' plants have their pages, feeds and reminders from the first start.
 */
export async function seedSales(db: AnyDb, storePlan: (plantId: number) => Promise<void>, today = new Date().toISOString().slice(0, 10)): Promise<void> {
	if ((await db.select({ n: count() }).from(stockBatches))[0].n > 0) return;
	const emails = new Map((await db.select().from(users)).map((u) => [u.email, u.id]));
	const person = (role: string, i = 0) => emails.get(DEMO_ACCOUNTS.filter((a) => a.role === role)[i].email)!;
	const owner = person('owner');
	const seller = person('staff');
	const [pim, sol, mae] = [0, 1, 2].map((i) => DEMO_ACCOUNTS.filter((a) => a.role === 'gardener')[i]);

	const stock = createStockService({ db });
	// The demo sends no mail: buyers' links are on the cards and in the developer mailbox's place.
	const sales = createSalesService({ db, secret: () => claimSecret(db, config), link: (p) => new URL(p, config.publicUrl).toString(), mail: async () => false, nursery: async () => DEMO_NURSERY });
	const claims = createClaimService({
		db,
		consume: async () => ({ allowed: true }),
		climateBySlug: async (slug) => (await db.select({ id: climateProfiles.id }).from(climateProfiles).where(eq(climateProfiles.slug, slug)))[0],
		afterClaim: storePlan
	});

	// The nursery's usual prices, filled in on the stall (in the nursery's currency, cents).
	const prices: Record<string, number> = { 'grand-nain': 1800, 'dwarf-cavendish': 1600, 'ice-cream': 2200, goldfinger: 2000, 'red-dacca': 2400 };
	for (const [slug, cents] of Object.entries(prices)) {
		await db.update(cultivars).set({ usualPriceCents: cents }).where(and(eq(cultivars.slug, slug), isNull(cultivars.usualPriceCents)));
	}

	const receive = (cultivar: string, count: number, weeksOld: number) =>
		stock.receive({ cultivar, count, pottedOn: daysFrom(today, -7 * weeksOld), location: undefined }, owner, today);
	const grandNain = await receive('grand-nain', 30, 22);
	const dwarf = await receive('dwarf-cavendish', 20, 20);
	const iceCream = await receive('ice-cream', 12, 18);
	await receive('goldfinger', 8, 14);
	await receive('red-dacca', 6, 16);

	// Ten weeks ago at the quay: the demo gardeners' plants.
	const past = daysFrom(today, -70);
	const pastDay = await stock.addMarketDay({ on: past, place: MARKET });
	await stock.move({ batchId: grandNain.id, count: 8, to: pastDay.id }, seller);
	await stock.move({ batchId: iceCream.id, count: 4, to: pastDay.id }, seller);
	const loaded = (await stock.dayReport(pastDay.id, today)).rows;
	const pastGrandNain = loaded.find((r) => r.cultivar.slug === 'grand-nain')!.id;
	const pastIceCream = loaded.find((r) => r.cultivar.slug === 'ice-cream')!.id;
	const sell = (n: number, batchId: number, quantity: number, price: number, on: string, buyerEmail?: string) =>
		sales.record({ clientId: id(n), batchId, quantity, pricePerPlant: price, ...(buyerEmail ? { buyerEmail } : {}) }, seller, on);
	const pimSale = await sell(1, pastGrandNain, 2, 18, past, pim.email);
	const solSale = await sell(2, pastIceCream, 1, 22, past, sol.email);
	await sell(3, pastGrandNain, 1, 18, past, mae.email); // Mae has not claimed hers yet.
	await sell(4, pastIceCream, 1, 22, past);
	for (const r of (await stock.dayReport(pastDay.id, today)).rows) if (r.onHand > 0) await stock.move({ batchId: r.id, count: r.onHand, to: null }, seller);

	const code = (link: string) => link.split('/claim/')[1];
	const claim = (link: string, gardener: number, plantedOn: string, climate = referenceClimateSlug) =>
		claims.claim(code(link), gardener, { plantedOn, climate, units: 'metric' }, '127.0.0.1', today);
	await claim(pimSale.plants[0].claimLink, person('gardener', 0), daysFrom(past, 3));
	await claim(pimSale.plants[1].claimLink, person('gardener', 0), daysFrom(past, 10));
	await claim(solSale.plants[0].claimLink, person('gardener', 1), daysFrom(past, 5));

	// Today at the quay: plants loaded for the stall and the first sales of the day.
	const todayDay = await stock.addMarketDay({ on: today, place: MARKET });
	await stock.move({ batchId: grandNain.id, count: 10, to: todayDay.id }, seller);
	await stock.move({ batchId: dwarf.id, count: 6, to: todayDay.id }, seller);
	const onStall = (await stock.dayReport(todayDay.id, today)).rows;
	await sell(5, onStall[0].id, 1, 18, today);
	await sell(6, onStall[1].id, 2, 16, today, mae.email);
}
