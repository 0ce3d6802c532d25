// Staff work the nursery's table of plants: filter, sort, page through without a reload, export.
import { parse } from 'csv-parse/sync';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { STAGE_CHOICES } from '../../src/lib/schema/plant-table';
import { expectAccessible, launch, newContext, open, signIn } from '../helpers/browser';
import { insertPlants, testCultivar, testUser } from '../helpers/plant-rows';

const [first, second] = STAGE_CHOICES;
let browser: Browser;
let cultivarName: string;
let cultivarSlug: string;
/** Plants of the test cultivar at the first stage: the filter's answer. */
let expectedIds: number[];
/** The same plants by next step, earliest first. */
let expectedOrder: number[];

const day = (offset: number) => new Date(Date.UTC(2027, 0, 1 + offset)).toISOString().slice(0, 10);

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	const [cultivar, other, gardener] = await Promise.all([testCultivar('Marrowby Table Red'), testCultivar('Quay Table Lady'), testUser('gardener', 'Tamsin Reedway')]);
	cultivarName = cultivar.name;
	cultivarSlug = cultivar.slug;
	// 23 plants at the first stage (three pages of 10), 5 at the second, 6 of another cultivar.
	const matching = await insertPlants(
		Array.from({ length: 23 }, (_, i) => ({
			cultivarId: cultivar.id,
			soldOn: '2026-03-07',
			gardenerId: gardener.id,
			stage: first.stage,
			// Shuffled, so sorting has work to do.
			nextStepOn: day((i * 7) % 23),
			nextStepKind: 'feeding'
		}))
	);
	await insertPlants([
		...Array.from({ length: 5 }, (_, i) => ({ cultivarId: cultivar.id, soldOn: '2026-03-07', gardenerId: gardener.id, stage: second.stage, nextStepOn: day(i), nextStepKind: 'shooting' })),
		...Array.from({ length: 6 }, (_, i) => ({ cultivarId: other.id, soldOn: '2026-03-07', gardenerId: gardener.id, stage: first.stage, nextStepOn: day(i), nextStepKind: 'feeding' }))
	]);
	expectedIds = matching.map((p) => p.id);
	expectedOrder = [...matching].sort((a, b) => a.nextStepOn!.localeCompare(b.nextStepOn!) || a.id - b.id).map((p) => p.id);
	browser = await launch();
});
afterAll(async () => browser?.close());

const rowIds = async (page: Page) =>
	(await page.locator('table.plant-table tbody tr td:first-child a').allTextContents()).map((t) => Number(t.match(/#(\d+)/)![1]));
const nextStepDates = async (page: Page) =>
	page.locator('table.plant-table tbody tr td[data-label="Next step"]').allTextContents();

describe('the nursery table', () => {
	it('filters by stage and cultivar, sorts by next step, pages without a reload, exports what it shows', async () => {
		const context = await newContext(browser);
		const page = await context.newPage();
		await signIn(page, DEMO_ACCOUNTS[1].email, DEMO_PASSWORD);
		await open(page, '/nursery/plants');
		await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Plants sold');
		await expectAccessible(page);
		// A full reload would wipe this.
		await page.evaluate(() => ((window as unknown as { stayed: boolean }).stayed = true));

		await page.getByLabel('Cultivar').selectOption(cultivarSlug);
		await page.waitForURL((u) => u.searchParams.get('cultivar') === cultivarSlug);
		await page.getByLabel('Stage').selectOption(first.stage);
		await page.waitForURL((u) => u.searchParams.get('stage') === first.stage);
		await page.getByLabel('Per page').selectOption('10');
		await page.waitForURL((u) => u.searchParams.get('perPage') === '10');
		await expect.poll(() => page.locator('#plant-total').textContent()).toBe('23 plants');

		// Sort by next step, latest first, from the column header, then back to earliest first.
		await page.getByRole('link', { name: 'Next step' }).click();
		await page.waitForURL((u) => u.searchParams.get('order') === 'desc');
		await page.getByRole('link', { name: 'Next step' }).click();
		await page.waitForURL((u) => !u.searchParams.has('order'));
		await expect.poll(() => page.locator('th[aria-sort="ascending"]').textContent()).toBe('Next step');

		const seen: number[] = [];
		for (let n = 1; n <= 3; n++) {
			await expect.poll(() => page.getByText(`Page ${n} of 3`, { exact: true }).count()).toBe(1);
			const ids = await rowIds(page);
			expect(ids.length).toBe(n < 3 ? 10 : 3);
			const cells = await nextStepDates(page);
			expect(cells.every((c) => c.includes('Feeding'))).toBe(true);
			seen.push(...ids);
			if (n < 3) {
				await page.getByRole('link', { name: 'Next', exact: true }).click();
				await page.waitForURL((u) => u.searchParams.get('page') === String(n + 1));
			}
		}
		// Every row of the filter, in next-step order across the pages, and never a full reload.
		expect(seen).toEqual(expectedOrder);
		expect(await page.evaluate(() => (window as unknown as { stayed?: boolean }).stayed)).toBe(true);

		// The back button walks the views back.
		await page.goBack();
		await page.waitForURL((u) => u.searchParams.get('page') === '2');
		await expect.poll(() => page.getByText("Page 2 of 3", { exact: true }).count()).toBe(1);

		// The export holds every plant of the filter, not just the page shown.
		const href = await page.getByRole('link', { name: /Export these plants/ }).getAttribute('href');
		expect(href).toContain(`cultivar=${cultivarSlug}`);
		expect(href).not.toContain('page=');
		const res = await page.request.get(href!);
		expect(res.status()).toBe(200);
		const [header, ...rows] = parse(await res.text()) as string[][];
		const col = (name: string) => header.indexOf(name);
		expect(rows.map((r) => Number(r[col('plant')])).sort()).toEqual([...expectedIds].sort());
		expect(new Set(rows.map((r) => r[col('cultivar')]))).toEqual(new Set([cultivarName]));
		expect(new Set(rows.map((r) => r[col('stage')]))).toEqual(new Set([first.label]));
		const dates = rows.map((r) => r[col('next step on')]);
		expect(dates).toEqual([...dates].sort());
		await context.close();
	}, 240_000);

	it('at phone width the rows read as labelled cards and the page stays accessible; a bad filter names the field', async () => {
		const context = await newContext(browser, { width: 360, height: 740 });
		const page = await context.newPage();
		await signIn(page, DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
		await open(page, `/nursery/plants?cultivar=${cultivarSlug}`);
		await expect.poll(() => page.locator('table.plant-table tbody tr').count()).toBe(25);
		const width = await page.evaluate(() => document.documentElement.scrollWidth);
		expect(width).toBeLessThanOrEqual(360);
		await expectAccessible(page);

		await open(page, '/nursery/plants?stage=ripe-ish');
		await expect.poll(() => page.getByRole('alert').textContent()).toContain('stage');
		await context.close();
	}, 120_000);
});
