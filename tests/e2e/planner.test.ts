import ICAL from 'ical.js';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, expectAccessible, launch, newContext } from '../helpers/browser';

let browser: Browser;
beforeAll(async () => {
	browser = await launch();
});
afterAll(async () => browser?.close());

describe('the year planner', () => {
	for (const viewport of [{ width: 1280, height: 900 }, { width: 390, height: 844 }]) {
		it(`draws a plan, its feeding table and calendar links at ${viewport.width}px`, async () => {
			const page = await (await newContext(browser, viewport)).newPage();
			await page.goto('/planner');
			await expectAccessible(page);
			await page.getByLabel('Cultivar').selectOption({ index: 2 });
			await page.getByLabel('Planting date').fill('2027-03-15');
			await page.getByRole('button', { name: 'Show plan' }).click();
			await page.waitForURL(/plantedOn=2027-03-15/);
			await expect.poll(() => page.locator('svg[role="img"]').count()).toBeGreaterThan(0);
			// The plan starts below the fold: focus and the view move to it, and screen readers hear it is ready.
			await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe('plan-title');
			const heading = await page.locator('#plan-title').boundingBox();
			expect(heading!.y).toBeGreaterThanOrEqual(0);
			expect(heading!.y).toBeLessThan(viewport.height / 2);
			await expect.poll(() => page.getByRole('status').textContent()).toMatch(/^Plan ready: .+, planted 15 Mar 2027, \d+ steps\.$/);
			expect(await page.getByRole('table').count()).toBeGreaterThan(0);
			await expectAccessible(page);

			const ics = await page.getByRole('link', { name: /Download calendar/ }).getAttribute('href');
			const res = await fetch(new URL(ics!, baseUrl()));
			expect(res.status).toBe(200);
			// RFC 5545 §3.6: the calendar parses and holds events.
			const cal = new ICAL.Component(ICAL.parse(await res.text()));
			expect(cal.getAllSubcomponents('vevent').length).toBeGreaterThan(10);
		});
	}

	it('a cool garden’s plan says why it is long, lists the steady feeding once, and prints as a clean sheet of at most two pages', async () => {
		const page = await (await newContext(browser)).newPage();
		await page.goto('/planner?cultivar=grand-nain&plantedOn=2027-03-15&ageAtPlantingWeeks=12&climate=southern-california-coast');
		expect(await page.getByTestId('long-plan-note').textContent()).toMatch(/cooler than bananas like/);
		// Runs of the same monthly feeding are one row each; the nursery's restricted months (other tests
		// may set some) keep rows of their own, so count feedings rather than expect a fixed row count.
		const rows = await page.getByRole('region', { name: /Feeding: amounts are for the whole mat/ }).locator('tbody tr').allTextContents();
		const feedings = rows.reduce((n, row) => n + Number(/(\d+) feedings/.exec(row)?.[1] ?? 1), 0);
		expect(feedings).toBeGreaterThan(40);
		expect(rows.length).toBeLessThan(feedings / 3);
		expect(rows.some((row) => /^\s*Monthly, .+ to .+\d+ feedings/.test(row))).toBe(true);
		await expectAccessible(page);

		await page.emulateMedia({ media: 'print' });
		for (const hidden of [page.locator('header').first(), page.getByRole('button', { name: 'Show plan' }), page.getByRole('link', { name: /Download calendar/ })]) {
			expect(await hidden.isVisible()).toBe(false);
		}
		expect(await page.locator('#plan-title').isVisible()).toBe(true);
		expect(await page.locator('svg[role="img"]').isVisible()).toBe(true);
		const pdf = (await page.pdf({ format: 'A4' })).toString('latin1');
		const pages = pdf.match(/\/Type\s*\/Page(?!s)/g)?.length ?? 0;
		expect(pages).toBeGreaterThanOrEqual(1);
		expect(pages).toBeLessThanOrEqual(2);
	});

	it('shows the reason beside the field for bad input', async () => {
		const page = await (await newContext(browser)).newPage();
		const res = await page.goto('/planner?cultivar=grand-nain&plantedOn=2027-02-30&ageAtPlantingWeeks=12&climate=south-florida-coast');
		expect(res?.status()).toBe(400);
		await expectAccessible(page);
		expect(await page.locator('[aria-invalid="true"]').count()).toBeGreaterThan(0);
	});
});

describe('the public API through the production server', () => {
	it('answers a body that is not JSON with 400, also from another site with a form type', async () => {
		const variants: Record<string, string>[] = [{ 'content-type': 'application/json' }, { 'content-type': 'text/plain', origin: 'http://elsewhere.example' }, {}];
		for (const headers of variants) {
			const res = await fetch(`${baseUrl()}/api/v1/plan-preview`, { method: 'POST', headers, body: 'not json' });
			expect(res.status).toBe(400);
			const body = await res.json();
			expect(body.error.message).toBeTruthy();
			expect(Array.isArray(body.error.issues)).toBe(true);
		}
	});

	it('names the field of an unknown cultivar', async () => {
		const res = await fetch(`${baseUrl()}/api/v1/plan-preview`, {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: JSON.stringify({ cultivar: 'no-such-banana', plantedOn: '2027-01-01', ageAtPlantingWeeks: 10, climate: 'south-florida-coast' })
		});
		expect(res.status).toBe(400);
		expect((await res.json()).error.issues[0].path).toEqual(['cultivar']);
	});
});
