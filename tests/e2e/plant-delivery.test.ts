// The plant page's delivery parts on a phone-sized screen: the gardener adds the plant to their
// calendar (address shown once, with its QR code), and staff see the plant's reminder e-mails, a
// failure with its reason, and send the failed one again.
import ICAL from 'ical.js';
import { and, eq } from 'drizzle-orm';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { db } from '../../src/lib/server/db';
import { reminders, users } from '../../src/lib/server/db/schema';
import { expectAccessible, launch, newContext, open, signIn } from '../helpers/browser';
import { insertPlant } from '../helpers/plants';

let browser: Browser;
let plantId: number;
const sol = DEMO_ACCOUNTS.find((a) => a.email.startsWith('gardener.sol'))!;
const ines = DEMO_ACCOUNTS.find((a) => a.email.startsWith('staff.ines'))!;
const phone = { width: 360, height: 780 };

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, sol.email));
	plantId = (await insertPlant({ gardenerId: row.id, plantedOn: new Date().toISOString().slice(0, 10) })).id;
	browser = await launch();
});
afterAll(async () => browser?.close());

describe('the plant page delivers the plan', () => {
	it('the gardener adds this plant to their calendar: both links and a QR code, once; ical.js reads the feed', async () => {
		const page = await (await newContext(browser, phone)).newPage();
		await signIn(page, sol.email, DEMO_PASSWORD);
		await open(page, `/plants/${plantId}`);
		await page.getByText('No calendar address for this plant yet').waitFor();
		await page.getByRole('button', { name: 'Add this plant to my calendar' }).click();
		const https = await page.getByLabel('Address (https)').inputValue();
		expect(https).toMatch(/\/feeds\/[a-z2-7]{32}\.ics$/);
		expect(await page.getByLabel('Address (webcal)').inputValue()).toBe(https.replace(/^http:/, 'webcal:'));
		expect(await page.getByRole('img', { name: 'QR code of the calendar address' }).locator('svg').count()).toBe(1);
		await page.getByText('iPhone or iPad:').waitFor();
		await expectAccessible(page);
		expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(phone.width);

		const feed = await fetch(https);
		expect(feed.status).toBe(200);
		const calendar = new ICAL.Component(ICAL.parse(await feed.text()));
		expect(String(calendar.getFirstPropertyValue('x-wr-calname'))).toContain(`#${plantId}`);
		const events = calendar.getAllSubcomponents('vevent');
		expect(events.length).toBeGreaterThan(10);
		expect(events.every((e) => String(e.getFirstPropertyValue('description')).includes(`/plants/${plantId}`))).toBe(true);

		await page.reload();
		expect(await page.getByLabel('Address (https)').count()).toBe(0);
		await page.getByText('This plant has 1 calendar address.').waitFor();

		// Sending a reminder again is for staff: the gardener's own post is refused.
		const refused = await page.request.post(`/plants/${plantId}?/resend`, { form: { id: '1' }, headers: { origin: new URL(page.url()).origin }, maxRedirects: 0 });
		expect(refused.status()).toBe(403);
	}, 180_000);

	it('staff see the reminders of the plant, a failure and its reason, and send it again', async () => {
		const [one] = await db.select({ id: reminders.id, title: reminders.title }).from(reminders).where(eq(reminders.plantId, plantId)).limit(1);
		expect(one).toBeDefined();
		await db.update(reminders).set({ state: 'failed', attempts: 1, lastError: '550 5.1.1 Mailbox unavailable', updatedAt: new Date() }).where(eq(reminders.id, one.id));

		const page = await (await newContext(browser, phone)).newPage();
		await signIn(page, ines.email, DEMO_PASSWORD);
		await open(page, `/plants/${plantId}`);
		const section = page.getByRole('region', { name: 'Reminder e-mails' });
		await section.getByText('Last error: 550 5.1.1 Mailbox unavailable').waitFor();
		await expect.poll(() => section.getByText('1 failed').count()).toBe(1);
		expect(await page.getByRole('button', { name: 'Add this plant to my calendar' }).count()).toBe(0);
		await expectAccessible(page);
		expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(phone.width);

		await section.getByRole('button', { name: `Send “${one.title}” again` }).click();
		await page.getByText('The reminder is queued again').waitFor();
		const [after] = await db.select({ state: reminders.state }).from(reminders).where(and(eq(reminders.id, one.id)));
		expect(after.state).toBe('due');
	}, 180_000);
});
