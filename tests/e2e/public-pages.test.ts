// Every public page, at desktop and phone width: it answers, has a title and a main heading,
// and passes axe with no serious or critical violations.
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listGuides } from '../../src/lib/guides';
import { expectAccessible, launch, newContext } from '../helpers/browser';

let browser: Browser;
beforeAll(async () => {
	browser = await launch();
});
afterAll(async () => browser?.close());

const pages: [string, number][] = [
	['/', 200],
	['/planner', 200],
	['/guides', 200],
	...listGuides().map((g): [string, number] => [`/guides/${g.slug}`, 200]),
	['/login', 200],
	['/signup', 200],
	['/reset', 200],
	['/verify?token=abcdefghijklmnopqrstuvwxyz234567', 200],
	['/signup?invite=abcdefghijklmnopqrstuvwxyz234567', 200],
	['/no-such-page', 404],
	['/guides/no-such-guide', 404]
];

describe('public pages', () => {
	for (const viewport of [{ width: 1280, height: 900 }, { width: 390, height: 844 }]) {
		for (const [path, status] of pages) {
			it(`${path} at ${viewport.width}px`, async () => {
				const page = await (await newContext(browser, viewport)).newPage();
				const res = await page.goto(path);
				expect(res?.status()).toBe(status);
				expect((await page.title()).length).toBeGreaterThan(3);
				expect(await page.getByRole('heading', { level: 1 }).count()).toBe(1);
				await expectAccessible(page);
				await page.context().close();
			});
		}
	}
});
