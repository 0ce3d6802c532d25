// The owner's guides in a real browser: hostile Markdown renders harmlessly (no dialog, no console
// error, which includes a blocked script) both stored and in the live preview; revisions restore exactly.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { expectAccessible, launch, newContext, open, signIn, watch } from '../helpers/browser';
import { eq } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/db/schema';
import { guideService } from '../../src/lib/server/guides/service';
import { guideSchema } from '../../src/lib/schema/guides';
import { HOSTILE_MARKDOWN } from '../fixtures/hostile-markdown';

let browser: Browser;
let ownerId = 0;
beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	browser = await launch();
	[{ id: ownerId }] = await db.select({ id: users.id }).from(users).where(eq(users.email, DEMO_ACCOUNTS[0].email));
});
afterAll(async () => browser?.close());

/** Written and published through the service (the forms themselves are exercised below), so 38 pages stay quick. */
async function publishedGuide(title: string, body: string): Promise<string> {
	const who = { id: ownerId, role: 'owner' as const };
	const guide = await guideService.create(guideSchema.parse({ title, summary: 'A test of hostile text.', body }), who);
	await guideService.publish(guide.id, who);
	return `/guides/${guide.slug}`;
}

describe('hostile Markdown', () => {
	it('each input renders harmlessly on the published page', { timeout: 180_000 }, async () => {
		const page = await (await newContext(browser)).newPage();
		const problems = watch(page);
		for (const [i, { name, markdown }] of HOSTILE_MARKDOWN.entries()) {
			const path = await publishedGuide(`Hostile ${i} ${name} ${Date.now().toString(36)}`, `Before.\n\n${markdown}\n\nAfter.`);
			const res = await page.goto(path);
			expect(res?.status(), name).toBe(200);
			expect(await page.locator('article').innerText(), name).toContain('After.');
			expect(await page.locator('article script, article iframe, article object, article [style], article [onerror], article [onload]').count(), name).toBe(0);
			expect(problems, name).toEqual([]);
		}
	});

	it('the live preview shows them all harmlessly as they are typed', async () => {
		const context = await newContext(browser);
		const page = await context.newPage();
		const problems = watch(page);
		await signIn(page, DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
		await open(page, '/nursery/guides/new');
		await page.getByRole('textbox', { name: 'Text (Markdown)' }).fill(HOSTILE_MARKDOWN.map((h) => h.markdown).join('\n\n') + '\n\nEnd of the list.');
		await expect.poll(() => page.getByTestId('markdown-preview').innerText()).toContain('End of the list.');
		expect(await page.locator('[data-testid="markdown-preview"] :is(script, iframe, object, [style], [onerror], [onload])').count()).toBe(0);
		expect(problems).toEqual([]);
	});
});

describe('revisions', () => {
	it('a draft saved twice and restored shows the first text exactly', { timeout: 150_000 }, async () => {
		const page = await (await newContext(browser)).newPage();
		const problems = watch(page);
		await signIn(page, DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
		await open(page, '/nursery/guides/new');
		await expectAccessible(page);
		const first = 'Mulch **thickly**,  with two spaces.\n\n- one\n- two\n';
		await page.getByLabel('Title').fill(`Mulching in the dry season ${Date.now().toString(36)}`);
		await page.getByLabel('Summary (one sentence)').fill('Keep the roots cool through the dry months.');
		await page.getByRole('textbox', { name: 'Text (Markdown)' }).fill(first);
		await page.getByRole('button', { name: 'Save draft' }).click();
		await page.waitForURL(/\/nursery\/guides\/\d+/);
		await page.waitForLoadState('networkidle');
		await expect.poll(() => page.getByRole('status').innerText()).toContain('revision 1');

		await page.getByRole('textbox', { name: 'Text (Markdown)' }).fill('Something else entirely.');
		await page.getByRole('button', { name: 'Save', exact: true }).click();
		await expect.poll(() => page.getByRole('status').innerText()).toContain('revision 2');

		await page.getByRole('link', { name: /Compare with the one before.*revision 2/ }).click();
		await page.waitForURL(/revisions\/2$/);
		await expectAccessible(page);
		expect(await page.locator('pre').innerText()).toContain('Something else entirely.');
		await page.goBack();
		await page.waitForLoadState('networkidle');

		await page.getByRole('button', { name: 'Restore revision 1' }).click();
		await expect.poll(() => page.getByRole('status').innerText()).toContain('Revision 1 is back');
		expect(await page.getByRole('textbox', { name: 'Text (Markdown)' }).inputValue()).toBe(first);
		await expectAccessible(page);
		expect(problems).toEqual([]);
	});
});
