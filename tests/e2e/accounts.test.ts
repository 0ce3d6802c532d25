import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../scripts/seed';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { HOME_FOR } from '../../src/lib/nav';
import { expectAccessible, launch, newContext, open, signIn } from '../helpers/browser';
import { uniqueEmail } from '../helpers/db';
import { linkIn, waitForMail } from '../helpers/mail';

let browser: Browser;

beforeAll(async () => {
	// The demo accounts, seeded into this run's own test database.
	await seedDemo(process.env.DATABASE_URL!);
	browser = await launch();
});
afterAll(async () => browser?.close());

async function freshPage(viewport?: { width: number; height: number }): Promise<Page> {
	return (await newContext(browser, viewport)).newPage();
}

describe('a buyer creates an account and looks after it', () => {
	it('signs up, confirms through the e-mailed link, signs out, resets the password and signs in', async () => {
		const page = await freshPage({ width: 390, height: 844 });
		const email = uniqueEmail('buyer');

		await page.goto('/');
		expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('banana');
		await expectAccessible(page);

		await open(page, '/signup');
		await expectAccessible(page);
		await page.getByLabel('Your name').fill('Dana Buyer');
		await page.getByLabel('E-mail').fill(email);
		await page.getByLabel('Choose a password').fill('short');
		await page.getByRole('button', { name: 'Create account' }).click();
		await expect.poll(() => page.locator('#field-password-error').textContent()).toContain('at least 8');
		await expect.poll(() => page.getByLabel('E-mail').inputValue()).toBe(email);

		await page.getByLabel('Choose a password').fill('green bunches all year');
		await page.getByRole('button', { name: 'Create account' }).click();
		await page.getByRole('heading', { name: 'Check your e-mail' }).waitFor();
		await expectAccessible(page);

		const verify = linkIn(await waitForMail(email, 'Confirm'));
		await page.goto(verify.pathname + verify.search);
		await page.getByRole('button', { name: 'Confirm my e-mail' }).click();
		await page.waitForURL(/\/login\?verified=1/);
		await expectAccessible(page);

		await signIn(page, email, 'green bunches all year');
		expect(new URL(page.url()).pathname).toBe('/plants');
		await expectAccessible(page);

		await page.getByRole('button', { name: 'Menu' }).click();
		await page.getByRole('button', { name: 'Sign out' }).click();
		await page.waitForURL((u) => u.pathname === '/');
		await page.goto('/plants');
		expect(new URL(page.url()).pathname).toBe('/login');

		await open(page, '/reset');
		await expectAccessible(page);
		await page.getByLabel('E-mail').fill(email);
		await page.getByRole('button', { name: 'Send me a reset link' }).click();
		await page.getByText('a reset link is on its way').waitFor();
		const reset = linkIn(await waitForMail(email, 'Reset'));
		await page.goto(reset.pathname + reset.search);
		await page.getByLabel('New password').fill('ripe hands in the shade');
		await page.getByRole('button', { name: 'Save the new password' }).click();
		await page.waitForURL(/\/login\?reset=done/);

		// The link is single use.
		await page.goto(reset.pathname + reset.search);
		await page.getByLabel('New password').fill('another try at this');
		await page.getByRole('button', { name: 'Save the new password' }).click();
		await page.getByRole('alert').filter({ hasText: 'expired or was already used' }).waitFor();

		await signIn(page, email, 'ripe hands in the shade');
		expect(new URL(page.url()).pathname).toBe('/plants');
	});

	it('shows a message beside the field for a duplicate e-mail and a wrong password', async () => {
		const page = await freshPage();
		await open(page, '/signup');
		await page.getByLabel('Your name').fill('Copy Cat');
		await page.getByLabel('E-mail').fill(DEMO_ACCOUNTS[3].email);
		await page.getByLabel('Choose a password').fill('a fine long phrase');
		await page.getByRole('button', { name: 'Create account' }).click();
		await expect.poll(() => page.locator('#field-email-error').textContent()).toContain('already exists');

		await open(page, '/login');
		await page.getByLabel('E-mail').fill(DEMO_ACCOUNTS[3].email);
		await page.getByLabel('Password').fill('not the demo password');
		await page.getByRole('button', { name: 'Sign in' }).click();
		await expect.poll(() => page.locator('#field-password-error').textContent()).toContain('do not match');
		await expectAccessible(page);
	});
});

describe('demo accounts', () => {
	for (const account of DEMO_ACCOUNTS) {
		it(`${account.role} ${account.email} lands on the page for the role`, async () => {
			const page = await freshPage();
			await signIn(page, account.email, DEMO_PASSWORD);
			expect(new URL(page.url()).pathname).toBe(HOME_FOR[account.role as keyof typeof HOME_FOR]);
			await expectAccessible(page);
		});
	}

	it('the owner invites a staff member who joins through the e-mailed link', async () => {
		const page = await freshPage();
		await signIn(page, DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
		await open(page, '/nursery/team');
		await expectAccessible(page);
		const email = uniqueEmail('hire');
		await page.getByRole('textbox', { name: 'E-mail' }).fill(email);
		await page.getByRole('button', { name: 'Send invitation' }).click();
		await page.getByText(`Invitation sent to ${email}`).waitFor();

		const invite = linkIn(await waitForMail(email, 'invited'));
		const other = await freshPage();
		await other.goto(invite.pathname + invite.search);
		await expectAccessible(other);
		await other.getByLabel('Your name').fill('New Hire');
		await other.getByLabel('Choose a password').fill('stall mornings are early');
		await other.getByRole('button', { name: 'Join the team' }).click();
		await other.waitForURL((u) => u.pathname === '/nursery/stall');
	});

	it('the owner can read captured mail in the developer mailbox', async () => {
		const page = await freshPage();
		await signIn(page, DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
		await page.goto('/dev/mail');
		await expectAccessible(page);
		await page.getByRole('link').filter({ hasText: /invited|Confirm|Reset/ }).first().click();
		await page.getByText('expires').waitFor();
	});
});
