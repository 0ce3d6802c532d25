import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../scripts/seed';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { HOME_FOR } from '../../src/lib/nav';
import { expectAccessible, launch, newContext, open, signIn } from '../helpers/browser';
import { and, eq, ne } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/db/schema';
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

		// The link is single use, and says so before asking for a password.
		await page.goto(reset.pathname + reset.search);
		await page.getByRole('alert').filter({ hasText: 'expired or was already used' }).waitFor();
		await page.getByRole('link', { name: 'Request a new link' }).waitFor();

		await signIn(page, email, 'ripe hands in the shade');
		expect(new URL(page.url()).pathname).toBe('/plants');
	});

	it('a used e-mail gets the same answer as a new one, and a wrong password a message beside the field', async () => {
		const page = await freshPage();
		await open(page, '/signup');
		await page.getByLabel('Your name').fill('Copy Cat');
		await page.getByLabel('E-mail').fill(DEMO_ACCOUNTS[3].email);
		await page.getByLabel('Choose a password').fill('a fine long phrase');
		await page.getByRole('button', { name: 'Create account' }).click();
		await page.getByRole('heading', { name: 'Check your e-mail' }).waitFor();
		await waitForMail(DEMO_ACCOUNTS[3].email, 'Someone tried to open');

		await open(page, '/login');
		await page.getByLabel('E-mail').fill(DEMO_ACCOUNTS[3].email);
		await page.getByLabel('Password').fill('not the demo password');
		await page.getByRole('button', { name: 'Sign in' }).click();
		await expect.poll(() => page.locator('#field-password-error').textContent()).toContain('do not match');
		await expectAccessible(page);
	});
});

describe('a buyer sees how strong a new password is as it is typed', () => {
	it('the hint names a common password as weak and a phrase as strong', async () => {
		const page = await freshPage({ width: 360, height: 780 });
		await open(page, '/signup');
		const hint = page.getByTestId('password-strength');
		await page.getByLabel('Choose a password').pressSequentially('P@ssw0rd');
		await expect.poll(() => hint.textContent()).toMatch(/weak/i);
		await page.getByLabel('Choose a password').fill('');
		await page.getByLabel('Choose a password').pressSequentially('lantern moss over the quay');
		await expect.poll(() => hint.textContent()).toMatch(/strong/i);
		await expectAccessible(page);
	});
});

describe('the team page, as a new owner tries it', () => {
	it('a role change asks first, names the person, and a cancelled one leaves the menu as it was', async () => {
		const page = await freshPage();
		await signIn(page, DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
		const teo = 'Quill Newhand';
		await db.insert(users).values({ email: uniqueEmail('quill'), name: teo, passwordHash: 'not-a-hash', role: 'staff', emailVerifiedAt: new Date() });
		await open(page, '/nursery/team');
		// Gardeners (buyers) are not part of the team list.
		await expect.poll(() => page.getByRole('cell', { name: DEMO_ACCOUNTS[3].name }).count()).toBe(0);
		const menu = page.getByLabel(`Role of ${teo}`).first();
		await menu.selectOption('owner');
		await menu.locator('xpath=ancestor::form').getByRole('button', { name: 'Change…' }).click();
		await page.getByRole('heading', { name: `Make ${teo} owner?` }).waitFor();
		await expectAccessible(page);
		await page.getByRole('link', { name: 'Cancel' }).click();
		// The question goes once the page has loaded again; choosing before that would be re-drawn away.
		await page.getByRole('heading', { name: `Make ${teo} owner?` }).waitFor({ state: 'detached' });
		await expect.poll(() => page.getByLabel(`Role of ${teo}`).first().inputValue()).toBe('staff');
		await page.getByLabel(`Role of ${teo}`).first().selectOption('owner');
		await page.getByLabel(`Role of ${teo}`).first().locator('xpath=ancestor::form').getByRole('button', { name: 'Change…' }).click();
		await page.getByRole('button', { name: 'Yes, make owner' }).click();
		await page.getByText(`${teo} is now owner`).waitFor();
		// Rows keep their places: the list is in name order, not role order.
		const names = await page.locator('tbody tr td:first-child').allTextContents();
		expect(names.map((n) => n.replace(/\s*\(.*\)$/, ''))).toEqual([...names.map((n) => n.replace(/\s*\(.*\)$/, ''))].sort((a, b) => a.localeCompare(b)));
	});

	it('a refused role change does not leave the menu on the refused role', async () => {
		const page = await freshPage();
		await signIn(page, DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
		await open(page, '/nursery/team');
		// Every other owner steps down first, so the demo owner is the only one.
		await db.update(users).set({ role: 'staff' }).where(and(eq(users.role, 'owner'), ne(users.email, DEMO_ACCOUNTS[0].email)));
		const wren = DEMO_ACCOUNTS[0].name;
		const menu = page.getByLabel(`Role of ${wren}`).first();
		await menu.selectOption('staff');
		await menu.locator('xpath=ancestor::form').getByRole('button', { name: 'Change…' }).click();
		await page.getByRole('button', { name: 'Yes, make staff' }).click();
		await page.getByRole('alert').filter({ hasText: 'is the only owner' }).waitFor();
		await expect.poll(() => page.getByLabel(`Role of ${wren}`).first().inputValue()).toBe('owner');
	});
});

describe('the phone menu', () => {
	it('closes on a tap outside it', async () => {
		const page = await freshPage({ width: 360, height: 780 });
		await open(page, '/');
		await page.getByRole('button', { name: 'Menu' }).click();
		await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Guides' }).waitFor();
		await page.mouse.click(180, 600);
		await expect.poll(() => page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false);
		expect(await page.getByRole('button', { name: 'Menu' }).getAttribute('aria-expanded')).toBe('false');
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
		await page.getByText(`Invitation to ${email} as staff is on its way`).waitFor();

		const invite = linkIn(await waitForMail(email, 'invites you'));
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
		await page.getByRole('link').filter({ hasText: /invites you|Confirm|Reset/ }).first().click();
		await page.getByText('expires').waitFor();
	});
});
