// The question board end to end, in Chromium at phone size (360 px): a gardener asks about their
// plant with a phone photo; staff find it at the top of the queue with the plant's stage and
// milestones beside it and answer; the asker is e-mailed, opens the answer and marks it resolved;
// the owner turns the answer into a draft guide, edits and publishes it; visitors find it in
// /guides, in search, and behind the plan step and the plant stage it was tagged for. Every page
// is watched for dialogs and console errors.
import { eq, sql } from 'drizzle-orm';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { stageLabel, isPlantStage } from '../../src/lib/care/stages';
import { milestoneSchema } from '../../src/lib/schema/plant';
import { db } from '../../src/lib/server/db';
import { plants, users } from '../../src/lib/server/db/schema';
import { plantService } from '../../src/lib/server/plants/plant-service';
import { GUIDE_FOR_STAGE } from '../../src/lib/stage-guides';
import { expectAccessible, launch, newContext, open, signIn, watch } from '../helpers/browser';
import { phonePhotoWithGps } from '../helpers/images';
import { linkIn, waitForMail } from '../helpers/mail';
import { insertPlant } from '../helpers/plants';

const PHONE = { width: 360, height: 780 };
const [OWNER, INES, , , , MAE] = DEMO_ACCOUNTS;
const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);
const TITLE = 'Pale stripes across the young leaves';
const ANSWER = 'Those pale stripes are wind scuffing on soft new leaves, not a disease. Shelter the plant from the sea breeze with a screen.';
const GUIDE_TITLE = 'Wind scuffing on young leaves';

let browser: Browser;
let plantId = 0;
let stage = '';
let questionId = 0;
let guidePath = '';

async function phone(email?: string): Promise<Page> {
	const page = await (await newContext(browser, PHONE)).newPage();
	const seen = watch(page);
	afterChecks.push(() => expect(seen, email ?? 'visitor').toEqual([]));
	if (email) await signIn(page, email, DEMO_PASSWORD);
	return page;
}
const afterChecks: (() => void)[] = [];

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	// The queue of this run: questions other files left waiting are answered, so "the top" is about order, not leftovers.
	await db.execute(sql`update questions set state = 'answered', answered_at = now() where state = 'waiting'`);
	const [mae] = await db.select().from(users).where(eq(users.email, MAE!.email));
	const plant = await insertPlant({ gardenerId: mae!.id, plantedOn: daysAgo(45) });
	plantId = plant.id;
	await plantService.log(mae!, plantId, milestoneSchema.parse({ kind: 'leaves', on: daysAgo(3), leaves: '4' }), new File([new Uint8Array(await phonePhotoWithGps(320, 240))], 'leaves.jpg', { type: 'image/jpeg' }));
	stage = (await db.select({ stage: plants.stage }).from(plants).where(eq(plants.id, plantId)))[0]!.stage ?? '';
	browser = await launch();
}, 60_000);
afterAll(async () => browser?.close());

// One story in steps that build on each other: a retried step would post twice, so none is retried.
describe('from a phone photo to a published guide', { retry: 0 }, () => {
	it('the plant is young enough that its stage and its next feeding share one guide', () => {
		expect(isPlantStage(stage) && GUIDE_FOR_STAGE[stage]).toBe('feeding');
	});

	it('a gardener asks about their plant with a phone photo', { timeout: 120_000 }, async () => {
		const page = await phone(MAE!.email);
		await open(page, `/ask?plant=${plantId}`);
		await expectAccessible(page);
		await page.getByLabel('Your question in a line').fill(TITLE);
		await expect.poll(() => page.getByLabel('About which plant?').inputValue()).toBe(String(plantId));
		await page.getByRole('textbox', { name: 'What do you see?' }).fill('Since the windy week the two newest leaves have pale stripes running across them, between the veins.');
		await page.getByLabel('Photos (optional)').setInputFiles({ name: 'IMG_2041.jpg', mimeType: 'image/jpeg', buffer: await phonePhotoWithGps(1200, 900) });
		await page.getByLabel('Others may read it once answered').check();
		await page.getByRole('button', { name: 'Send question' }).click();
		await page.waitForURL(/\/questions\/\d+\?asked=1$/);
		questionId = Number(new URL(page.url()).pathname.split('/').pop());
		await expect.poll(() => page.getByRole('img', { name: /^Photo 1 of 1 with the question/ }).count()).toBe(1);
		// Its own photo loads for the asker (a thumbnail, never the file as sent).
		const thumb = await page.request.get(`/uploads/${await photoIdOn(page, 'the question')}/thumbnail`);
		expect(thumb.status()).toBe(200);
		await page.context().close();
	});

	it('staff find it at the top of the queue with the plant beside it, and answer with a photo', { timeout: 120_000 }, async () => {
		const page = await phone(INES!.email);
		await open(page, '/nursery/questions');
		await expectAccessible(page);
		const first = page.getByRole('list', { name: 'Questions, longest waiting first' }).getByRole('listitem').first();
		await expect.poll(() => first.getByRole('heading').textContent()).toBe(TITLE);
		await first.getByRole('link', { name: TITLE }).click();
		await page.waitForURL(`**/nursery/questions/${questionId}`);
		const plant = page.getByLabel('The plant asked about');
		expect(await plant.textContent()).toContain(stageLabel(stage as Parameters<typeof stageLabel>[0]));
		expect(await plant.getByRole('img', { name: /^Photo logged with New leaves counted/ }).count()).toBe(1);
		expect(await page.getByRole('img', { name: /^Photo 1 of 1 with the question/ }).count()).toBe(1);
		await page.getByRole('button', { name: 'Claim' }).click();
		await page.getByText('Claimed: others see').waitFor();
		await page.getByRole('textbox', { name: 'Your answer' }).fill(ANSWER);
		await page.getByLabel('Photos (optional)').setInputFiles({ name: 'screen.jpg', mimeType: 'image/jpeg', buffer: await phonePhotoWithGps(800, 600) });
		await page.getByRole('button', { name: 'Send answer' }).click();
		await page.getByText('Answer sent.').waitFor();
		expect(await page.getByRole('img', { name: /^Photo 1 of 1 with this answer/ }).count()).toBe(1);
		await page.context().close();
	});

	it('the asker gets the e-mail, opens the answer and marks it resolved', { timeout: 120_000 }, async () => {
		const mail = await waitForMail(MAE!.email, `Your question has an answer: ${TITLE}`, 30_000);
		const link = linkIn(mail);
		expect(link.pathname).toBe(`/questions/${questionId}`);
		const page = await phone(MAE!.email);
		await open(page, link.pathname);
		await page.getByText('Those pale stripes are wind scuffing').waitFor();
		expect(await page.getByRole('img', { name: /^Photo 1 of 1 with this answer/ }).count()).toBe(1);
		await expectAccessible(page);
		await page.getByRole('button', { name: 'Mark resolved' }).click();
		await page.getByText('Marked resolved. Thank you!').waitFor();
		await page.context().close();
	});

	it('the owner turns the answer into a draft guide, edits it and publishes it', { timeout: 150_000 }, async () => {
		const page = await phone(OWNER!.email);
		await open(page, `/nursery/questions/${questionId}`);
		await page.getByRole('button', { name: 'Turn into a draft guide' }).click();
		await page.waitForURL(/\/nursery\/guides\/\d+\?saved=1$/);
		guidePath = new URL(page.url()).pathname;
		await page.waitForLoadState('networkidle');
		await page.getByLabel('Title', { exact: true }).fill(GUIDE_TITLE);
		await page.getByLabel('Summary (one sentence)').fill('Pale stripes after a windy week are scuffs on soft leaves, not a disease.');
		await page.getByLabel('Web address').fill('wind-scuffing');
		await page.getByRole('checkbox', { name: stageLabel('growing-leaves') }).check();
		await page.getByLabel('Takes the place of a built-in guide').selectOption('feeding');
		const text = page.getByRole('textbox', { name: 'Text (Markdown)' });
		await text.fill(`${await text.inputValue()}\n\n## Take care\n\nWear gloves when you put up a screen; keep ladders off wet ground.`);
		await page.getByRole('button', { name: 'Save' }).click();
		await page.getByText('Saved as revision 2.').waitFor();
		await page.getByRole('button', { name: 'Publish' }).click();
		await page.getByText('Published: it is on').waitFor();
		await expectAccessible(page);
		await page.context().close();
	});

	it('visitors find it in /guides, in search, behind the plan step and the plant stage it was tagged for', { timeout: 150_000 }, async () => {
		const page = await phone();
		await open(page, '/guides');
		await page.getByRole('link', { name: GUIDE_TITLE }).click();
		await page.waitForURL('**/guides/wind-scuffing');
		expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe(GUIDE_TITLE);

		await open(page, '/search?q=wind+scuffing');
		await expectAccessible(page);
		await page.getByRole('link', { name: GUIDE_TITLE }).first().click();
		await page.waitForURL('**/guides/wind-scuffing');

		// The plan's feeding step links to the built-in feeding guide, which now leads to the nursery's own.
		await open(page, `/planner?cultivar=grand-nain&plantedOn=${daysAgo(45)}&ageAtPlantingWeeks=12&climate=south-florida-coast`);
		const feeding = page.locator('a[href="/guides/feeding"]', { hasText: 'Read the guide' }).first();
		await feeding.click();
		await page.waitForURL('**/guides/wind-scuffing');
		await page.context().close();

		// The gardener's plant page: its stage links to the same guide.
		const mae = await phone(MAE!.email);
		await open(mae, `/plants/${plantId}`);
		await mae.getByRole('link', { name: '(what this stage means)' }).click();
		await mae.waitForURL('**/guides/wind-scuffing');
		await mae.context().close();
	});

	it('no page showed a dialog or logged an error', () => {
		expect(afterChecks.length).toBe(6);
		for (const check of afterChecks) check();
	});
});

/** The upload id behind the first photo of `of` on the page. */
async function photoIdOn(page: Page, of: string): Promise<number> {
	const src = await page.getByRole('img', { name: new RegExp(`^Photo 1 of \\d+ with ${of}`) }).first().getAttribute('src');
	return Number(src!.split('/')[2]);
}
