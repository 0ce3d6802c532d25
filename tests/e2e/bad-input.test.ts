// Bad input on every form: a 4xx, the reason shown beside the named field, and nothing written.
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { baseUrl } from '../helpers/browser';
import { tableCounts } from '../helpers/db';
import { sessionCookie } from '../helpers/session';

const long = (n: number) => 'a'.repeat(n);
let owner = '';
/** A draft guide and a gardener's question the cases below use ("{guide}", "{question}" in an action). */
let guideId = 0;
let questionId = 0;
let gardener = '';

async function submit(action: string, fields: Record<string, string>, cookie = '') {
	return fetch(`${baseUrl()}${action}`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: baseUrl(), ...(cookie ? { cookie } : {}) },
		body: new URLSearchParams(fields)
	});
}

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	const res = await submit('/login?/signin', { email: DEMO_ACCOUNTS[0].email, password: DEMO_PASSWORD });
	owner = res.headers.getSetCookie().find((c) => c.startsWith('bunchline_session='))!.split(';')[0];
	const draft = await submit('/nursery/guides/new', { title: 'Bad input target', summary: 'A draft to edit.', body: 'Text.' }, owner);
	guideId = Number(draft.headers.get('location')?.match(/\/nursery\/guides\/(\d+)/)?.[1]);
	if (!guideId) throw new Error(`no draft guide (${draft.status})`);
	gardener = await sessionCookie(DEMO_ACCOUNTS[3].email);
	const asked = await submit('/ask', { title: 'Bad input question', body: 'A question the cases below reply to.' }, gardener);
	questionId = Number(asked.headers.get('location')?.match(/\/questions\/(\d+)/)?.[1]);
	if (!questionId) throw new Error(`no question (${asked.status})`);
});

const guide = { title: 'A fine guide', summary: 'One sentence.', body: 'Some text.' };

const token = 'abcdefghijklmnopqrstuvwxyz234567';
const cases: { form: string; action: string; fields: Record<string, string>; field: string; status: number; asOwner?: boolean; asGardener?: boolean }[] = [
	{ form: 'sign-up', action: '/signup?/create', fields: { name: '', email: 'x@example.test', password: 'long enough phrase' }, field: 'name', status: 400 },
	{ form: 'sign-up', action: '/signup?/create', fields: { name: long(81), email: 'x@example.test', password: 'long enough phrase' }, field: 'name', status: 400 },
	{ form: 'sign-up', action: '/signup?/create', fields: { name: 'A', email: 'not-an-email', password: 'long enough phrase' }, field: 'email', status: 400 },
	{ form: 'sign-up', action: '/signup?/create', fields: { name: 'A', email: `${long(250)}@x.test`, password: 'long enough phrase' }, field: 'email', status: 400 },
	{ form: 'sign-up', action: '/signup?/create', fields: { name: 'A', email: 'y@example.test', password: long(129) }, field: 'password', status: 400 },
	{ form: 'sign-up', action: '/signup?/create', fields: { name: 'A', email: 'y@example.test', password: 'password123' }, field: 'password', status: 400 },
	{ form: 'sign-in', action: '/login?/signin', fields: { email: '', password: '' }, field: 'email', status: 400 },
	{ form: 'sign-in', action: '/login?/signin', fields: { email: 'a@example.test', password: long(200) }, field: 'password', status: 400 },
	{ form: 'resend', action: '/login?/resend', fields: { email: 'nope' }, field: 'email', status: 400 },
	{ form: 'verify', action: '/verify', fields: { token: '' }, field: 'token', status: 400 },
	{ form: 'verify', action: '/verify', fields: { token }, field: 'token', status: 410 },
	{ form: 'reset request', action: '/reset?/request', fields: { email: '' }, field: 'email', status: 400 },
	{ form: 'reset', action: '/reset?/choose&token=' + token, fields: { token, password: 'short' }, field: 'password', status: 400 },
	{ form: 'reset', action: '/reset?/choose&token=' + token, fields: { token, password: 'a valid new phrase' }, field: 'token', status: 410 },
	{ form: 'invite acceptance', action: `/signup?/accept&invite=${token}`, fields: { token, name: 'A', password: 'a valid new phrase' }, field: 'token', status: 410 },
	{ form: 'invite', action: '/nursery/team?/invite', fields: { email: '', role: 'staff' }, field: 'email', status: 400, asOwner: true },
	{ form: 'invite', action: '/nursery/team?/invite', fields: { email: 'n@example.test', role: 'emperor' }, field: 'role', status: 400, asOwner: true },
	{ form: 'invite', action: '/nursery/team?/invite', fields: { email: DEMO_ACCOUNTS[1].email, role: 'staff' }, field: 'email', status: 409, asOwner: true },
	{ form: 'role', action: '/nursery/team?/role', fields: { userId: 'abc', role: 'staff' }, field: 'userId', status: 400, asOwner: true },
	{ form: 'role', action: '/nursery/team?/role', fields: { userId: '99999', role: 'staff' }, field: 'userId', status: 404, asOwner: true },
	{ form: 'new guide', action: '/nursery/guides/new', fields: { ...guide, title: '' }, field: 'title', status: 400, asOwner: true },
	{ form: 'new guide', action: '/nursery/guides/new', fields: { ...guide, summary: long(241) }, field: 'summary', status: 400, asOwner: true },
	{ form: 'new guide', action: '/nursery/guides/new', fields: { ...guide, body: '   ' }, field: 'body', status: 400, asOwner: true },
	{ form: 'new guide', action: '/nursery/guides/new', fields: { ...guide, body: long(50_001) }, field: 'body', status: 400, asOwner: true },
	{ form: 'new guide', action: '/nursery/guides/new', fields: { ...guide, slug: 'Not A Slug' }, field: 'slug', status: 400, asOwner: true },
	{ form: 'new guide', action: '/nursery/guides/new', fields: { ...guide, slug: 'feeding' }, field: 'slug', status: 409, asOwner: true },
	{ form: 'new guide', action: '/nursery/guides/new', fields: { ...guide, stages: 'spring' }, field: 'stages', status: 400, asOwner: true },
	{ form: 'new guide', action: '/nursery/guides/new', fields: { ...guide, groups: 'XYZ' }, field: 'groups', status: 400, asOwner: true },
	{ form: 'new guide', action: '/nursery/guides/new', fields: { ...guide, replaces: 'no-such-guide' }, field: 'replaces', status: 400, asOwner: true },
	{ form: 'guide', action: '/nursery/guides/{guide}?/save', fields: { ...guide, title: 'x' }, field: 'title', status: 400, asOwner: true },
	{ form: 'guide', action: '/nursery/guides/{guide}?/save', fields: { ...guide, slug: 'planting' }, field: 'slug', status: 409, asOwner: true },
	{ form: 'guide restore', action: '/nursery/guides/{guide}?/restore', fields: { revision: 'abc' }, field: 'revision', status: 400, asOwner: true },
	{ form: 'guide restore', action: '/nursery/guides/{guide}?/restore', fields: { revision: '999' }, field: 'revision', status: 404, asOwner: true },
	{ form: 'ask', action: '/ask', fields: { title: '', body: 'Long enough to be a question.' }, field: 'title', status: 400, asGardener: true },
	{ form: 'ask', action: '/ask', fields: { title: 'A question', body: 'short' }, field: 'body', status: 400, asGardener: true },
	{ form: 'ask', action: '/ask', fields: { title: 'A question', body: long(5001) }, field: 'body', status: 400, asGardener: true },
	{ form: 'ask', action: '/ask', fields: { title: 'A question', body: 'Long enough to be a question.', plantId: 'abc' }, field: 'plantId', status: 400, asGardener: true },
	{ form: 'ask', action: '/ask', fields: { title: 'A question', body: 'Long enough to be a question.', plantId: '999999' }, field: 'plantId', status: 404, asGardener: true },
	{ form: 'reply', action: '/questions/{question}?/reply', fields: { body: '  ' }, field: 'body', status: 400, asGardener: true },
	{ form: 'accept', action: '/questions/{question}?/accept', fields: { postId: 'x' }, field: 'postId', status: 400, asGardener: true },
	{ form: 'accept', action: '/questions/{question}?/accept', fields: { postId: '999999' }, field: 'postId', status: 404, asGardener: true },
	{ form: 'answer', action: '/nursery/questions/{question}?/answer', fields: { body: '' }, field: 'body', status: 400, asOwner: true },
	{ form: 'answer', action: '/nursery/questions/{question}?/answer', fields: { body: long(10_001) }, field: 'body', status: 400, asOwner: true },
	{ form: 'question state', action: '/nursery/questions/{question}?/state', fields: { state: 'deleted' }, field: 'state', status: 400, asOwner: true },
	{ form: 'answer to guide', action: '/nursery/questions/{question}?/guide', fields: { postId: '-1' }, field: 'postId', status: 400, asOwner: true },
	{ form: 'answer to guide', action: '/nursery/questions/{question}?/guide', fields: { postId: '999999' }, field: 'postId', status: 404, asOwner: true }
];

describe('every form refuses bad input without writing', () => {
	for (const c of cases) {
		it(`${c.form}: ${c.field} → ${c.status} (${JSON.stringify(c.fields).slice(0, 60)})`, async () => {
			const before = await tableCounts();
			const action = c.action.replace('{guide}', String(guideId)).replace('{question}', String(questionId));
			const res = await submit(action, c.fields, c.asOwner ? owner : c.asGardener ? gardener : '');
			expect(res.status).toBe(c.status);
			const html = await res.text();
			// Field errors are rendered with an id tied to the input; form-level ones in an alert.
			expect(html.includes(`field-${c.field}-error`) || html.includes('role="alert"')).toBe(true);
			expect(await tableCounts()).toEqual(before);
		});
	}
});
