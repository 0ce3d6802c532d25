// A gardener's plant in the browser: the stored plan, the milestone log with a phone photo,
// the plan moving and saying by how much, the photo stored without its GPS position, a division.
import { asc, eq } from 'drizzle-orm';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../scripts/seed';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { db } from '../../src/lib/server/db';
import { milestones, planSteps, plants, uploads, users } from '../../src/lib/server/db/schema';
import { describeShift } from '../../src/lib/plants/changes';
import { formatDay, generationLabel } from '../../src/lib/plan-text';
import { expectAccessible, launch, newContext, open, signIn } from '../helpers/browser';
import { gpsOf, phonePhotoWithGps, scriptAsJpeg } from '../helpers/images';
import { insertPlant } from '../helpers/plants';

const PIM = DEMO_ACCOUNTS[3]!.email;
const SOL = DEMO_ACCOUNTS[4]!.email;
const INES = DEMO_ACCOUNTS[1]!.email;
const isoDaysAfter = (iso: string, days: number) => new Date(Date.parse(iso) + days * 86_400_000).toISOString().slice(0, 10);
const today = new Date().toISOString().slice(0, 10);
const harvestOf = async (plantId: number) =>
	(await db.select().from(planSteps).where(eq(planSteps.plantId, plantId))).find((s) => s.kind === 'harvest' && s.generation === 0)!;

/** Axe on a page with a whole plan takes tens of seconds on a busy 2-core machine. */
const BROWSER_TEST_MS = 180_000;

let browser: Browser;
let plantId: number;
let pimId: number;
/** Each test its own plant, so a retry starts from a plant with nothing logged. */
const freshPlant = async () => (await insertPlant({ gardenerId: pimId, plantedOn: isoDaysAfter(today, -420) })).id;

async function signedIn(email: string, viewport?: { width: number; height: number }): Promise<Page> {
	const page = await (await newContext(browser, viewport)).newPage();
	await signIn(page, email, DEMO_PASSWORD);
	return page;
}

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	const [pim] = await db.select().from(users).where(eq(users.email, PIM));
	pimId = pim!.id;
	plantId = await freshPlant();
	browser = await launch();
});
afterAll(async () => browser?.close());

describe('a gardener’s plant', () => {
	it('logging the shooting day with a phone photo moves the harvest window, says by how much, and stores the photo without GPS', async () => {
		const page = await signedIn(PIM, { width: 360, height: 780 });
		const plantId = await freshPlant();
		await open(page, `/plants/${plantId}`);
		expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('Grand Nain');
		await page.getByRole('heading', { name: 'This week' }).waitFor();
		await expectAccessible(page);

		const before = await harvestOf(plantId);
		await page.getByRole('link', { name: 'Log what happened' }).click();
		await page.waitForURL(`**/plants/${plantId}/log`);
		await page.waitForLoadState('networkidle');
		await expectAccessible(page);
		const shotOn = isoDaysAfter(today, -20);
		await page.getByLabel('What happened').selectOption('shooting');
		await page.locator('#field-on').fill(shotOn);
		await page.getByLabel('Note (optional)').fill('Purple bud out this morning');
		await page.locator('#field-photo').setInputFiles({ name: 'IMG_2041.jpg', mimeType: 'image/jpeg', buffer: await phonePhotoWithGps() });
		await page.getByRole('button', { name: 'Log it and re-time the plan' }).click();
		await page.waitForURL(`**/plants/${plantId}?logged=1`);

		const after = await harvestOf(plantId);
		expect(after.uid).toBe(before.uid);
		const days = (Date.parse(after.likely) - Date.parse(before.likely)) / 86_400_000;
		expect(days).not.toBe(0);
		const moved = page.locator('section', { has: page.getByRole('heading', { name: /What moved/ }) });
		await expect.poll(() => moved.textContent()).toContain(`Harvest the bunch (${generationLabel(0)}) moved ${describeShift(days)} because the flower was logged on ${formatDay(shotOn)}`);
		await expectAccessible(page);

		const thumbnail = page.getByRole('img', { name: /Photo logged with shooting/ });
		const src = await thumbnail.getAttribute('src');
		const served = await page.request.get(src!.replace('thumbnail', 'display'));
		expect(served.status()).toBe(200);
		expect(served.headers()['x-content-type-options']).toBe('nosniff');
		expect(served.headers()['cache-control']).toMatch(/^private, max-age=\d{7,}/);
		const bytes = Buffer.from(await served.body());
		expect(bytes.subarray(0, 2)).toEqual(Buffer.from([0xff, 0xd8]));
		expect(gpsOf(bytes)).toBeUndefined();
		const [row] = await db.select().from(uploads).where(eq(uploads.id, Number(src!.split('/')[2])));
		expect(row!.contentType).toBe('image/jpeg');
	}, BROWSER_TEST_MS);

	it('a script disguised as a photo is refused beside the field and nothing is logged', async () => {
		const page = await signedIn(PIM);
		const plantId = await freshPlant();
		const count = async () => (await db.select().from(milestones).where(eq(milestones.plantId, plantId))).length;
		const before = await count();
		await open(page, `/plants/${plantId}/log`);
		await page.getByLabel('What happened').selectOption('flag-leaf');
		await page.locator('#field-on').fill(isoDaysAfter(today, -40));
		await page.locator('#field-photo').setInputFiles({ name: 'flower.jpg', mimeType: 'image/jpeg', buffer: scriptAsJpeg() });
		await page.getByRole('button', { name: 'Log it and re-time the plan' }).click();
		await expect.poll(() => page.locator('#field-photo-error').textContent()).toContain('not a JPEG, PNG or WebP');
		expect(await count()).toBe(before);
		await expectAccessible(page);
	}, BROWSER_TEST_MS);

	it('logging a division creates a second plant with its own plan, and each page shows the family', async () => {
		const page = await signedIn(PIM);
		const plantId = await freshPlant();
		await open(page, `/plants/${plantId}/log`);
		await page.getByLabel('What happened').selectOption('division');
		await page.locator('#field-on').fill(isoDaysAfter(today, -10));
		await page.getByRole('button', { name: 'Log it and re-time the plan' }).click();
		await page.waitForURL(/\?divided=\d+$/);
		const dividedId = Number(new URL(page.url()).searchParams.get('divided'));
		expect(dividedId).not.toBe(plantId);
		const [child] = await db.select().from(plants).where(eq(plants.id, dividedId));
		expect(child!.parentPlantId).toBe(plantId);
		const childSteps = await db.select().from(planSteps).where(eq(planSteps.plantId, dividedId)).orderBy(asc(planSteps.likely));
		expect(childSteps[0]).toMatchObject({ kind: 'planting', likely: isoDaysAfter(today, -10) });
		await page.getByRole('link', { name: 'open the divided plant' }).click();
		await page.waitForURL(`**/plants/${dividedId}`);
		await page.getByRole('heading', { name: "The mat's family" }).waitFor();
		expect(await page.getByRole('link', { name: /Grand Nain planted/ }).getAttribute('href')).toBe(`/plants/${plantId}`);
		await expectAccessible(page);
	}, BROWSER_TEST_MS);

	it('staff see the plant read-only', async () => {
		const page = await signedIn(INES);
		await open(page, `/plants/${plantId}`);
		await page.getByText('Only the gardener can change it').waitFor();
		expect(await page.getByRole('link', { name: 'Log what happened' }).count()).toBe(0);
		await expectAccessible(page);
	}, BROWSER_TEST_MS);

	it('another gardener is told the plant does not exist', async () => {
		const page = await signedIn(SOL);
		const res = await page.goto(`/plants/${plantId}`);
		expect(res!.status()).toBe(404);
	}, BROWSER_TEST_MS);
});
