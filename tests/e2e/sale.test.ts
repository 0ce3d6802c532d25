// The sale at a phone-sized stall, the care card's QR code, and the buyer claiming the plant.
import { eq } from 'drizzle-orm';
import jsQR from 'jsqr';
import type { Browser, Page } from 'playwright-core';
import { PNG } from 'pngjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { db } from '../../src/lib/server/db';
import { sales } from '../../src/lib/server/db/schema';
import { expectAccessible, launch, newContext, open, signIn } from '../helpers/browser';
import { uniqueEmail } from '../helpers/db';
import { linkIn, waitForMail } from '../helpers/mail';

const PHONE = { width: 360, height: 740 };
let browser: Browser;

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	browser = await launch();
});
afterAll(async () => browser?.close());

async function stallAsStaff(): Promise<Page> {
	const page = await (await newContext(browser, PHONE)).newPage();
	await signIn(page, DEMO_ACCOUNTS[1].email, DEMO_PASSWORD);
	await open(page, '/nursery/stall');
	return page;
}

/** Types a few letters, picks the first batch offered, and records a sale to the buyer. */
async function sell(page: Page, letters: string, buyer: string) {
	await page.getByLabel('Find a cultivar').fill(letters);
	await page.getByRole('radio').first().check();
	await expect.poll(() => page.getByLabel('Price per plant').inputValue()).toMatch(/^\d+\.\d\d$/);
	await page.getByLabel("Buyer's e-mail (optional)").fill(buyer);
	await page.getByRole('button', { name: /^Record sale/ }).click();
}

async function decodeQr(page: Page): Promise<string> {
	const png = PNG.sync.read(await page.locator('.qr').first().screenshot());
	const found = jsQR(new Uint8ClampedArray(png.data), png.width, png.height);
	if (!found) throw new Error('no QR code could be read from the care card');
	return found.data;
}

describe('a sale at the stall, claimed by its buyer', () => {
	it('staff sells on a phone; the card’s QR code and the e-mail carry the claim link; the buyer signs up, claims and sees the plant', async () => {
		const page = await stallAsStaff();
		await expectAccessible(page);
		// One-handed at 360 px: nothing wider than the screen, and the record button is a large target.
		expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
		const buyer = uniqueEmail('buyer');
		await sell(page, 'grand', buyer);
		await page.getByRole('status').filter({ hasText: 'Recorded: 1 × Grand Nain' }).waitFor();
		const box = await page.getByRole('button', { name: /^Record sale/ }).boundingBox();
		expect(box!.height).toBeGreaterThanOrEqual(44);

		await page.getByRole('link', { name: 'Care card' }).first().click();
		await page.waitForURL(/\/nursery\/sales\/\d+\/card/);
		await expectAccessible(page);
		const fromQr = await decodeQr(page);
		expect(fromQr).toMatch(/\/claim\/[a-z2-7]{32}$/);
		expect(await page.getByRole('heading', { name: 'Your first weeks' }).count()).toBeGreaterThan(0);

		const mailed = linkIn(await waitForMail(buyer, 'claim its care plan'));
		expect(mailed.toString()).toBe(fromQr);

		// The buyer, on their own phone.
		const phone = await (await newContext(browser, PHONE)).newPage();
		await open(phone, mailed.pathname);
		await expectAccessible(phone);
		await phone.getByRole('link', { name: 'Create an account' }).click();
		await phone.waitForURL(/\/signup\?next=/);
		await phone.getByLabel('Your name').fill('Robin Quayside');
		await phone.getByLabel('E-mail').fill(buyer);
		await phone.getByLabel('Choose a password').fill('a long banana phrase');
		await phone.getByRole('button', { name: 'Create account' }).click();
		const confirm = linkIn(await waitForMail(buyer, 'Confirm'));
		await open(phone, confirm.pathname + confirm.search);
		await phone.getByRole('button', { name: 'Confirm my e-mail' }).click();
		await phone.waitForURL(/\/login\?verified=1&next=/);
		await phone.getByLabel('E-mail').fill(buyer);
		await phone.getByLabel('Password').fill('a long banana phrase');
		await phone.getByRole('button', { name: 'Sign in' }).click();
		await phone.waitForURL((u) => u.pathname === mailed.pathname);
		await expectAccessible(phone);

		// A planting date before the sale is refused beside its field.
		await phone.getByLabel('Planting date').fill('2020-01-01');
		await phone.getByRole('button', { name: 'Claim this plant' }).click();
		await expect.poll(() => phone.locator('#field-plantedOn-error').textContent()).toContain('before the sale');
		// The refused form re-renders once more when the page's data reloads after the answer; typing before then would be overwritten.
		await phone.waitForLoadState('networkidle');

		const today = new Date().toISOString().slice(0, 10);
		await phone.getByLabel('Planting date').fill(today);
		await phone.getByLabel("Your garden's climate").selectOption({ index: 1 });
		expect(await phone.getByLabel('Planting date').inputValue()).toBe(today);
		await phone.getByRole('button', { name: 'Claim this plant' }).click();
		await phone.waitForURL(/\/plants\?claimed=\d+/);
		await expectAccessible(phone);
		const card = phone.getByRole('listitem').filter({ hasText: 'Grand Nain' });
		await expect.poll(() => card.textContent()).toMatch(/Next step.+around \d{1,2} \w{3} \d{4}/);
		await card.getByRole('link', { name: 'Grand Nain' }).click();
		await phone.waitForURL(/\/plants\/\d+$/);
		expect(await phone.getByRole('heading', { level: 1 }).textContent()).toContain('Grand Nain');

		// The code is used now: opening it again says so, with 410.
		const again = await phone.goto(mailed.pathname);
		expect(again?.status()).toBe(410);
	}, 240_000);

	it('a sale made offline waits on the phone and is stored exactly once when the signal returns', async () => {
		const page = await stallAsStaff();
		const buyer = uniqueEmail('offline');
		await page.context().setOffline(true);
		await sell(page, 'dwarf', buyer);
		await page.getByText('1 sale waiting').waitFor();
		expect(await db.select().from(sales).where(eq(sales.buyerEmail, buyer))).toHaveLength(0);
		await page.context().setOffline(false);
		await page.getByRole('status').filter({ hasText: 'Recorded: 1 × Dwarf Cavendish' }).waitFor({ timeout: 20_000 });
		expect(await page.getByText('sale waiting').count()).toBe(0);
		// A reload sends nothing again.
		await open(page, '/nursery/stall');
		expect(await db.select().from(sales).where(eq(sales.buyerEmail, buyer))).toHaveLength(1);
	}, 120_000);
});

describe('the demo seed', () => {
	it('gives a demo gardener claimed plants with their next step, and the public catalogue its stock', async () => {
		const page = await (await newContext(browser, PHONE)).newPage();
		await signIn(page, DEMO_ACCOUNTS[3].email, DEMO_PASSWORD);
		await open(page, '/plants');
		await expectAccessible(page);
		expect(await page.getByRole('listitem').filter({ hasText: 'Grand Nain' }).count()).toBeGreaterThanOrEqual(2);
		await open(page, '/cultivars');
		await expectAccessible(page);
		await expect.poll(() => page.getByRole('listitem').filter({ hasText: 'Goldfinger' }).textContent()).toContain('In stock');
	}, 120_000);

	it('staff see the stock page with today’s market day', async () => {
		const page = await (await newContext(browser, PHONE)).newPage();
		await signIn(page, DEMO_ACCOUNTS[1].email, DEMO_PASSWORD);
		await open(page, '/nursery/stock');
		await expectAccessible(page);
		expect(await page.getByRole('heading', { name: 'Market day: loaded, sold, left' }).count()).toBe(1);
		expect(await page.getByRole('table').count()).toBe(1);
	}, 120_000);
});
