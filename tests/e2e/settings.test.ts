// /settings in the browser: calendar feeds (address shown once, QR code, stop), reminder preferences,
// a reminder in the developer mailbox unsubscribed in one click, and the staff view of reminders.
import ICAL from 'ical.js';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/db/schema';
import { and, eq } from 'drizzle-orm';
import { reminderPreferences, reminders } from '../../src/lib/server/db/schema';
import { createDispatcher } from '../../src/lib/server/reminders/dispatch';
import { reminderRepository } from '../../src/lib/server/reminders/repository';
import { reminderTransport } from '../../src/lib/server/reminders/worker';
import { expectAccessible, launch, newContext, open, signIn } from '../helpers/browser';
import { insertPlant } from '../helpers/plants';

let browser: Browser;
let maeId: number;
const mae = DEMO_ACCOUNTS.find((a) => a.email.startsWith('gardener.mae'))!;

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, mae.email));
	maeId = row.id;
	await insertPlant({ gardenerId: row.id, plantedOn: new Date().toISOString().slice(0, 10) });
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
		// A shared 2-core machine: two sign-ins and several page loads take longer than the default minute.
		}, 180_000);
});

describe('reminder e-mails', () => {
	it('a gardener chooses a weekly digest at 07:00 in their zone; the owner sees a reminder in the dev mailbox and unsubscribes in one click; staff see it sent', async () => {
		const page = await (await newContext(browser, { width: 360, height: 780 })).newPage();
		await signIn(page, mae.email, DEMO_PASSWORD);
		await open(page, '/settings');
		await page.getByLabel(/One e-mail a week/).check();
		await page.getByLabel('At', { exact: true }).selectOption('7');
		await page.getByLabel('Your time zone').selectOption('Europe/Lisbon');
		await page.getByRole('button', { name: 'Save' }).click();
		await page.getByText('Saved. Reminders not yet sent follow your new choices.').waitFor();
		await expectAccessible(page);
		const [prefs] = await db.select().from(reminderPreferences).where(eq(reminderPreferences.userId, maeId));
		expect(prefs).toMatchObject({ mode: 'weekly-digest', hour: 7, timeZone: 'Europe/Lisbon' });

		// Back to one e-mail per step, and one reminder made due now, sent the way the worker sends it.
		await page.getByLabel(/An e-mail for each step/).check();
		await page.getByRole('button', { name: 'Save' }).click();
		// "Saved." is already on the page from the first save: wait for the new choice to be stored
		// (the save re-syncs the reminders in the same transaction) before picking a due row.
		await expect
			.poll(async () => (await db.select().from(reminderPreferences).where(eq(reminderPreferences.userId, maeId)))[0]?.mode, { timeout: 15_000 })
			.toBe('each-step');
		const [due] = await db.select({ id: reminders.id }).from(reminders).where(and(eq(reminders.userId, maeId), eq(reminders.state, 'due'))).limit(1);
		await db.update(reminders).set({ dueAt: new Date(Date.now() - 60_000) }).where(eq(reminders.id, due.id));
		const transport = reminderTransport();
		const origin = new URL(page.url()).origin;
		const dispatcher = createDispatcher(
			reminderRepository,
			{ send: async (m) => void (await transport.sendMail(m)) },
			{ leaseMs: 60_000, retryBaseMs: 1000, maxAttempts: 3, batchSize: 50, pickLimit: 50, concurrency: 1, mail: { from: 'Bunchline <plans@bunchline.test>', origin }, messageDomain: 'bunchline.test' }
		);
		await dispatcher.send([due.id]);
		transport.close();

		const owner = await (await newContext(browser)).newPage();
		await signIn(owner, DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
		await open(owner, '/dev/mail');
		await owner.getByRole('link', { name: /Grand Nain #\d+/ }).first().click();
		await owner.getByRole('button', { name: 'Unsubscribe in one click' }).waitFor();
		await expectAccessible(owner);
		await owner.getByRole('button', { name: 'Unsubscribe in one click' }).click();
		await owner.getByRole('heading', { name: 'Reminders are off' }).waitFor();
		const [after] = await db.select().from(reminderPreferences).where(eq(reminderPreferences.userId, maeId));
		expect(after.mode).toBe('off');

		await open(owner, `/nursery/reminders?state=sent`);
		await owner.getByText(mae.email).first().waitFor();
		await expectAccessible(owner);
	}, 180_000);
});
