// The question board end to end in Chromium: a gardener asks about their plant → staff see it at
// the top of the queue with the plant's stage and milestones → answer → the asker is e-mailed,
// opens the answer and marks it resolved → the owner turns the answer into a draft guide, edits it
// to take the place of the built-in harvest guide and publishes it → it is on /guides, in search,
// and the plan's harvest step leads to it.
import { eq, ne, and } from 'drizzle-orm';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { db } from '../../src/lib/server/db';
import { milestones, questions, users } from '../../src/lib/server/db/schema';
import { findGuide } from '../../src/lib/guides';
import { expectAccessible, launch, newContext, open, signIn } from '../helpers/browser';
import { linkIn, waitForMail } from '../helpers/mail';
import { plantOf } from '../helpers/people';

const [OWNER, STAFF, , , , GARDENER] = DEMO_ACCOUNTS;
let browser: Browser;
let plantId = 0;
const word = `marrowbyquay${Date.now().toString(36)}`;

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	browser = await launch();
	const [mae] = await db.select({ id: users.id }).from(users).where(eq(users.email, GARDENER.email));
	plantId = await plantOf(mae.id, { stage: 'flowering', nextStepKind: 'harvest', nextStepOn: '2027-01-20' });
	await db.insert(milestones).values([
		{ plantId, kind: 'shooting', on: '2026-09-14' },
		{ plantId, kind: 'flag-leaf', on: '2026-09-01' }
	]);
});
afterAll(async () => browser?.close());

async function pageAs(email: string, viewport = { width: 1280, height: 900 }): Promise<Page> {
	const page = await (await newContext(browser, viewport)).newPage();
	await signIn(page, email, DEMO_PASSWORD);
	return page;
}

describe('from question to published guide', () => {
	it('runs the whole way', { timeout: 240_000 }, async () => {
		// The gardener asks, on a phone-sized screen.
		const gardener = await pageAs(GARDENER.email, { width: 360, height: 780 });
		await open(gardener, `/ask?plant=${plantId}`);
		await expectAccessible(gardener);
		await gardener.getByLabel('Your question in a line').fill(`When do I cut the bunch? ${word}`);
		expect(await gardener.getByLabel('About which plant?').inputValue()).toBe(String(plantId));
		await gardener.getByRole('textbox', { name: 'What do you see?' }).fill('The flower came out in **September**. The fingers are filling out.');
		await gardener.getByLabel('Others may read it once answered').check();
		await gardener.getByRole('button', { name: 'Send question' }).click();
		await gardener.waitForURL(/\/questions\/\d+\?asked=1/);
		const questionId = Number(new URL(gardener.url()).pathname.split('/').pop());
		await expectAccessible(gardener);

		// The queue is otherwise empty, so the new question is at the top.
		await db.update(questions).set({ state: 'resolved' }).where(and(eq(questions.state, 'waiting'), ne(questions.id, questionId)));

		// Staff see it first, with the plant's stage and milestones beside it, and answer it.
		const staff = await pageAs(STAFF.email);
		await open(staff, '/nursery/questions');
		await expectAccessible(staff);
		const first = staff.getByRole('list', { name: 'Questions, longest waiting first' }).getByRole('listitem').first();
		expect(await first.innerText()).toContain(word);
		expect(await first.innerText()).toMatch(/flowering/);
		expect(await first.innerText()).toMatch(/Shooting|shooting/);
		await first.getByRole('link').first().click();
		await staff.waitForURL(new RegExp(`/nursery/questions/${questionId}$`));
		await staff.waitForLoadState('networkidle');
		await staff.getByRole('button', { name: 'Claim' }).click();
		await expect.poll(() => staff.getByText('Claimed by you').count()).toBeGreaterThan(0);
		await staff.getByRole('textbox', { name: 'Your answer' }).fill(`Cut when the fingers lose their angles and the first one yellows: about **four months** after the flower. ${word}`);
		await staff.getByRole('button', { name: 'Send answer' }).click();
		await expect.poll(() => staff.getByRole('status').first().innerText()).toContain('Answer sent');
		await expectAccessible(staff);

		// The asker gets the e-mail, opens the answer and marks the question resolved.
		const mail = await waitForMail(GARDENER.email, 'Your question has an answer');
		const link = linkIn(mail);
		expect(link.pathname).toBe(`/questions/${questionId}`);
		await open(gardener, link.pathname);
		expect(await gardener.locator('article').innerText()).toContain('four months');
		await gardener.getByRole('button', { name: 'Mark resolved' }).click();
		await expect.poll(() => gardener.getByRole('status').first().innerText()).toContain('resolved');

		// The owner turns the answer into a draft guide, edits it and publishes it.
		const owner = await pageAs(OWNER.email);
		await open(owner, `/nursery/questions/${questionId}`);
		await owner.getByRole('button', { name: 'Turn into a draft guide' }).click();
		await owner.waitForURL(/\/nursery\/guides\/\d+\?saved=1/);
		await owner.waitForLoadState('networkidle');
		await owner.getByLabel('Title').fill(`Cutting the bunch at Kestrel Hollow ${word}`);
		await owner.getByLabel('Web address').fill(`cutting-the-bunch-${word}`);
		await owner.getByLabel('Takes the place of a built-in guide').selectOption({ label: findGuide('harvest')!.title });
		const body = owner.getByRole('textbox', { name: 'Text (Markdown)' });
		await body.fill(`${await body.inputValue()}\n\nUse a sharp, clean blade and have a helper take the weight.`);
		await owner.getByRole('button', { name: 'Save', exact: true }).click();
		await expect.poll(() => owner.getByRole('status').first().innerText()).toContain('revision 2');
		await owner.getByRole('button', { name: 'Publish' }).click();
		await expect.poll(() => owner.getByRole('status').first().innerText()).toContain('Published');

		// Everyone sees it: in the list, in search, and behind the plan's harvest step.
		const visitor = await (await newContext(browser)).newPage();
		await open(visitor, '/guides');
		expect(await visitor.getByRole('list', { name: 'Guides' }).innerText()).toContain(`Cutting the bunch at Kestrel Hollow ${word}`);
		await open(visitor, `/search?q=${word}`);
		await expectAccessible(visitor);
		expect(await visitor.getByRole('region', { name: /Guides/ }).innerText()).toContain('Cutting the bunch at Kestrel Hollow');
		expect(await visitor.getByRole('region', { name: /Questions and answers/ }).innerText()).toContain('When do I cut the bunch?');
		await open(visitor, '/planner?cultivar=grand-nain&plantedOn=2026-03-15&ageAtPlantingWeeks=12&climate=south-florida-coast');
		await visitor.locator('a[href="/guides/harvest"]').first().click();
		await visitor.waitForURL(new RegExp(`/guides/cutting-the-bunch-${word}$`));
		expect(await visitor.locator('h1').innerText()).toContain('Cutting the bunch at Kestrel Hollow');
		expect(await visitor.locator('article').innerText()).toContain('sharp, clean blade');
	});
});
