// Every public page, at desktop and phone width: it answers, has a title and a main heading,
// and passes axe with no serious or critical violations.
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { seedDemo } from '../../scripts/seed';
import { listGuides } from '../../src/lib/guides';
import { db } from '../../src/lib/server/db';
import { guides, questions } from '../../src/lib/server/db/schema';
import { expectAccessible, launch, newContext } from '../helpers/browser';

let browser: Browser;
/** The demo's published owner guides and answered public questions, found once the seed has run. */
const demoBoardPages: string[] = [];
beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	for (const g of await db.select({ slug: guides.slug }).from(guides).where(eq(guides.status, 'published'))) demoBoardPages.push(`/guides/${g.slug}`);
	for (const q of await db.select({ id: questions.id }).from(questions).where(and(eq(questions.isPublic, true), eq(questions.state, 'answered')))) demoBoardPages.push(`/questions/${q.id}`);
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
	['/guides/no-such-guide', 404],
	['/questions', 200],
	['/search', 200],
	['/search?q=bunch', 200]
];

describe('public pages', () => {
	for (const viewport of [{ width: 1280, height: 900 }, { width: 390, height: 844 }, { width: 360, height: 780 }]) {
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

describe('the demo board', () => {
	it('shows the owner’s published guides and answered public questions to visitors, at phone width, with axe passing', { timeout: 120_000 }, async () => {
		expect(demoBoardPages.filter((p) => p.startsWith('/guides/')).length).toBeGreaterThanOrEqual(2);
		expect(demoBoardPages.filter((p) => p.startsWith('/questions/')).length).toBeGreaterThanOrEqual(2);
		const page = await (await newContext(browser, { width: 360, height: 780 })).newPage();
		for (const path of ['/guides', '/questions', ...demoBoardPages]) {
			expect((await page.goto(path))?.status(), path).toBe(200);
			expect(await page.getByRole('heading', { level: 1 }).count(), path).toBe(1);
			await expectAccessible(page);
		}
		await page.goto('/questions');
		expect(await page.getByRole('link', { name: 'Three suckers at once: which one do I keep?' }).count()).toBe(1);
		await page.goto('/guides');
		expect(await page.getByRole('link', { name: 'Propping a heavy bunch' }).count()).toBe(1);
		await page.context().close();
	});
});
