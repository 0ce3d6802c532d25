import AxeBuilder from '@axe-core/playwright';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { expect, inject } from 'vitest';

const FLAGS = [
	'--headless',
	'--no-sandbox',
	'--disable-gpu',
	'--disable-quic',
	'--no-first-run',
	'--disable-background-networking',
	'--disable-component-update',
	'--disable-sync'
];

export async function launch(): Promise<Browser> {
	return chromium.launch({
		executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
		// playwright gives every launch a fresh, empty profile of its own (the --user-data-dir).
		args: FLAGS
	});
}

export const baseUrl = () => inject('baseUrl');

/** A fresh context that fails the test on any request leaving the app (fonts, CDNs, trackers). */
export async function newContext(browser: Browser, viewport = { width: 1280, height: 900 }): Promise<BrowserContext> {
	const context = await browser.newContext({ baseURL: baseUrl(), viewport });
	// A stuck step fails on its own, with what it waited for, well inside the test's time.
	context.setDefaultTimeout(15_000);
	const origin = new URL(baseUrl()).origin;
	context.on('request', (req) => {
		const url = new URL(req.url());
		if (url.protocol.startsWith('http') && url.origin !== origin) throw new Error(`external request to ${req.url()}`);
	});
	await context.route(/^(?!http:\/\/127\.0\.0\.1)https?:/, (route) => {
		expect.fail(`external request to ${route.request().url()}`);
		return route.abort();
	});
	return context;
}

/** axe-core on the current page: no serious or critical violations. */
export async function expectAccessible(page: Page): Promise<void> {
	const results = await new AxeBuilder({ page }).analyze();
	const bad = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
	expect(bad.map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`), page.url()).toEqual([]);
}

/** Opens a page and waits until its scripts have loaded, so forms are enhanced before they are used. */
export async function open(page: Page, path: string): Promise<void> {
	await page.goto(path);
	await page.waitForLoadState('networkidle');
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
	await open(page, '/login');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill(password);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await page.waitForURL((u) => !u.pathname.startsWith('/login'));
}

/** Fails the test on any alert or prompt (a confirm is answered yes) and on any console error. */
export function watch(page: Page): string[] {
	const problems: string[] = [];
	page.on('dialog', async (d) => {
		if (d.type() === 'confirm') return d.accept();
		problems.push(`${d.type()}: ${d.message()}`);
		await d.dismiss();
	});
	page.on('console', (m) => {
		if (m.type() === 'error') problems.push(`console: ${m.text()}`);
	});
	page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
	return problems;
}
