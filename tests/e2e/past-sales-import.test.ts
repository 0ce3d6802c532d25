// Staff import past sales from a CSV: one bad row and nothing is written, the error names the row;
// with the row fixed, every row is written.
import { count, inArray } from 'drizzle-orm';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { PAST_SALE_COLUMNS } from '../../src/lib/schema/past-sales';
import { db } from '../../src/lib/server/db';
import { sales } from '../../src/lib/server/db/schema';
import { expectAccessible, launch, newContext, open, signIn } from '../helpers/browser';

let browser: Browser;
const tag = Date.now().toString(36);
const buyers = Array.from({ length: 40 }, (_, i) => `import.${tag}.${i}@example.test`);
const csv = (badRow?: number) =>
	[
		PAST_SALE_COLUMNS.join(','),
		...buyers.map((b, i) => `Grand Nain,2025-0${1 + (i % 9)}-1${i % 10},${i % 30},${b},${i === badRow ? 'free' : '18.50'},Marrowby Quay Saturday Market`)
	].join('\r\n') + '\r\n';
const imported = async () => (await db.select({ n: count() }).from(sales).where(inArray(sales.buyerEmail, buyers)))[0].n;

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	browser = await launch();
});
afterAll(async () => browser?.close());

describe('importing past sales', () => {
	it('refuses a file with one bad row, naming it, then imports the fixed file in full', async () => {
		const context = await newContext(browser);
		const page = await context.newPage();
		await signIn(page, DEMO_ACCOUNTS[1].email, DEMO_PASSWORD);
		await open(page, '/nursery/plants');
		await page.getByRole('link', { name: 'Import past sales' }).click();
		await page.waitForURL('**/nursery/plants/import');
		await expectAccessible(page);
		const template = await page.getByRole('link', { name: /Download the template/ }).getAttribute('href');
		expect(decodeURIComponent(template!.split(',').slice(1).join(','))).toContain(PAST_SALE_COLUMNS.join(','));

		// Row 8 of the file (the header is row 1) has a price of "free".
		await page.getByLabel(/CSV file/).setInputFiles({ name: 'sales.csv', mimeType: 'text/csv', buffer: Buffer.from(csv(6)) });
		await page.getByRole('button', { name: 'Import' }).click();
		await expect.poll(() => page.getByRole('alert').textContent()).toContain('Nothing was imported');
		expect(await page.getByRole('alert').textContent()).toContain('Row 8, price');
		expect(await imported()).toBe(0);

		await page.getByLabel(/CSV file/).setInputFiles({ name: 'sales.csv', mimeType: 'text/csv', buffer: Buffer.from(csv()) });
		await page.getByRole('button', { name: 'Import' }).click();
		await expect.poll(() => page.getByRole('status').filter({ hasText: 'Imported' }).textContent()).toContain('Imported 40 sales');
		expect(await page.locator('#import-progress').getAttribute('value')).toBe('100');
		expect(await imported()).toBe(40);
		await expectAccessible(page);
		await context.close();
	}, 180_000);
});
