// /settings in the browser: a gardener adds a calendar feed, sees its address once with a QR code, and stops it.
import ICAL from 'ical.js';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/db/schema';
import { eq } from 'drizzle-orm';
import { expectAccessible, launch, newContext, open, signIn } from '../helpers/browser';
import { insertPlant } from '../helpers/plants';

let browser: Browser;
const mae = DEMO_ACCOUNTS.find((a) => a.email.startsWith('gardener.mae'))!;

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, mae.email));
	await insertPlant({ gardenerId: row.id, plantedOn: '2026-03-01' });
	browser = await launch();
});
afterAll(async () => browser?.close());

describe('calendar feeds in /settings', () => {
	it('adds a feed, shows its address once with a QR code, and stops it, on a phone-sized screen', async () => {
			const page = await (await newContext(browser, { width: 360, height: 780 })).newPage();
			await signIn(page, mae.email, DEMO_PASSWORD);
			await open(page, '/settings');
			await expectAccessible(page);
			await page.getByLabel('Add a calendar of').selectOption({ label: 'All my plants' });
			await page.getByRole('button', { name: 'Add calendar' }).click();
			const https = await page.getByLabel('Address (https)').inputValue();
			expect(await page.getByLabel('Address (webcal)').inputValue()).toBe(https.replace(/^http:/, 'webcal:'));
			expect(await page.getByRole('img', { name: 'QR code of the calendar address' }).locator('svg').count()).toBe(1);
			await expectAccessible(page);

			const feed = await fetch(https);
			expect(feed.status).toBe(200);
			const events = new ICAL.Component(ICAL.parse(await feed.text())).getAllSubcomponents('vevent');
			expect(events.length).toBeGreaterThan(20);

			await page.reload();
			expect(await page.getByLabel('Address (https)').count()).toBe(0);
			const row = page.getByRole('listitem').filter({ hasText: 'All my plants' }).first();
			await row.getByText('Stop…').click();
			await row.getByRole('button', { name: 'Yes, stop this feed' }).click();
			await page.getByText('That calendar address no longer works').waitFor();
			expect((await fetch(https)).status).toBe(404);
		});
});
