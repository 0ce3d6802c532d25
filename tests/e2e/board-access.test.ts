// ASVS 5.0 V8.2.2 (data-specific access): another gardener's private question, its answer and
// every photo on it answer 404 on every route and endpoint, for visitors too, and nothing
// changes; the asker and staff reach each of them. Staff cannot publish a guide or turn an
// answer into one (V8.2.1, function-level access).
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { askSchema } from '../../src/lib/schema/questions';
import { boardService } from '../../src/lib/server/board/service';
import { db } from '../../src/lib/server/db';
import { guides, questionPosts, questions, users } from '../../src/lib/server/db/schema';
import { guideService } from '../../src/lib/server/guides/service';
import { guideSchema } from '../../src/lib/schema/guides';
import { baseUrl } from '../helpers/browser';
import { phonePhotoWithGps } from '../helpers/images';
import { sessionCookie } from '../helpers/session';

const [OWNER, INES, , PIM, SOL] = DEMO_ACCOUNTS;
let pim: string, sol: string, ines: string;
let questionId = 0, answerId = 0, questionPhoto = 0, answerPhoto = 0, draftId = 0;

const request = (cookie: string, method: string, path: string, form?: URLSearchParams) =>
	fetch(`${baseUrl()}${path}`, {
		method,
		redirect: 'manual',
		headers: { ...(cookie ? { cookie } : {}), origin: baseUrl(), ...(form ? { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html' } : {}) },
		body: form
	});
const snapshot = async () => ({
	question: (await db.select().from(questions).where(eq(questions.id, questionId)))[0],
	posts: await db.select().from(questionPosts).where(eq(questionPosts.questionId, questionId)),
	guides: await db.select({ id: guides.id, status: guides.status }).from(guides).where(eq(guides.id, draftId))
});
const photo = async () => new File([new Uint8Array(await phonePhotoWithGps(300, 200))], 'p.jpg', { type: 'image/jpeg' });

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	const [asker] = await db.select().from(users).where(eq(users.email, PIM!.email));
	const [staff] = await db.select().from(users).where(eq(users.email, INES!.email));
	const [owner] = await db.select().from(users).where(eq(users.email, OWNER!.email));
	const q = await boardService.ask(askSchema.parse({ title: 'A private worry about my mat', body: 'Only the nursery should read this one.' }), asker!, [await photo()]);
	questionId = q.id;
	await boardService.answer(q.id, 'A private answer.', staff!, async () => undefined, [await photo()]);
	const v = await boardService.view(q.id, asker!, '2026-12-01');
	answerId = v.posts[0]!.id;
	questionPhoto = v.photos[0]!.uploadId;
	answerPhoto = v.posts[0]!.photos[0]!.uploadId;
	draftId = (await guideService.create(guideSchema.parse({ title: 'A draft for the access test', summary: 'Draft.', body: 'Draft text.' }), owner!)).id;
	[pim, sol, ines] = await Promise.all([PIM, SOL, INES].map((a) => sessionCookie(a!.email)));
});

describe('ASVS V8.2.2: another gardener’s private question, answer and photos do not exist for you', () => {
	const cases = (): [string, string, URLSearchParams?][] => [
		['GET', `/questions/${questionId}`],
		['GET', `/uploads/${questionPhoto}/thumbnail`],
		['GET', `/uploads/${questionPhoto}/display`],
		['GET', `/uploads/${answerPhoto}/thumbnail`],
		['GET', `/uploads/${answerPhoto}/display`],
		['POST', `/questions/${questionId}?/reply`, new URLSearchParams({ body: 'me too' })],
		['POST', `/questions/${questionId}?/resolve`, new URLSearchParams()],
		['POST', `/questions/${questionId}?/accept`, new URLSearchParams({ postId: String(answerId) })],
		['POST', `/questions/${questionId}?/remove`, new URLSearchParams()]
	];

	it('every route and endpoint answers 404 to another gardener and to a visitor, and nothing changes', async () => {
		const before = await snapshot();
		for (const who of [sol, '']) {
			for (const [method, path, form] of cases()) {
				const res = await request(who, method, path, form);
				// A signed-out form post is sent to sign in first; it reveals nothing either.
				if (!who && method === 'POST') expect([303, 404], path).toContain(res.status);
				else expect(res.status, `${who ? 'Sol' : 'visitor'} ${method} ${path}`).toBe(404);
			}
		}
		expect(await snapshot()).toEqual(before);
	});

	it('the page’s data endpoint (used by client-side navigation) carries the 404 and nothing of the question', async () => {
		for (const who of [sol, '']) {
			const body = await (await request(who, 'GET', `/questions/${questionId}/__data.json`)).text();
			expect(body).toMatch(/"status":404/);
			expect(body).not.toContain('private');
		}
	});

	it('is not listed, nor found by search, for them', async () => {
		for (const who of [sol, '']) {
			expect(await (await request(who, 'GET', '/questions')).text()).not.toContain('A private worry about my mat');
			expect(await (await request(who, 'GET', '/search?q=private+worry')).text()).not.toContain('A private worry about my mat');
		}
	});

	it('the asker and staff reach each page and photo', async () => {
		for (const who of [pim, ines]) {
			for (const [method, path] of cases().filter(([m]) => m === 'GET')) expect((await request(who, method, path)).status, path).toBe(200);
		}
	});
});

describe('ASVS V8.2.1: staff cannot publish', () => {
	it('publishing, unpublishing and answer-to-guide are 403 for staff and change nothing', async () => {
		const before = await snapshot();
		expect((await request(ines, 'POST', `/nursery/guides/${draftId}?/publish`, new URLSearchParams())).status).toBe(403);
		expect((await request(ines, 'POST', `/nursery/guides/${draftId}?/unpublish`, new URLSearchParams())).status).toBe(403);
		expect((await request(ines, 'POST', `/nursery/questions/${questionId}?/guide`, new URLSearchParams({ postId: String(answerId) }))).status).toBe(403);
		expect(await snapshot()).toEqual(before);
	});
});
