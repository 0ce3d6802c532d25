// Bad input on every form: a 4xx, the reason shown beside the named field, and nothing written.
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { baseUrl } from '../helpers/browser';
import { tableCounts } from '../helpers/db';

const long = (n: number) => 'a'.repeat(n);
let owner = '';

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
});

const token = 'abcdefghijklmnopqrstuvwxyz234567';
const cases: { form: string; action: string; fields: Record<string, string>; field: string; status: number; asOwner?: boolean }[] = [
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
	{ form: 'role', action: '/nursery/team?/role', fields: { userId: '99999', role: 'staff' }, field: 'userId', status: 404, asOwner: true }
];

describe('every form refuses bad input without writing', () => {
	for (const c of cases) {
		it(`${c.form}: ${c.field} → ${c.status} (${JSON.stringify(c.fields).slice(0, 60)})`, async () => {
			const before = await tableCounts();
			const res = await submit(c.action, c.fields, c.asOwner ? owner : '');
			expect(res.status).toBe(c.status);
			const html = await res.text();
			// Field errors are rendered with an id tied to the input; form-level ones in an alert.
			expect(html.includes(`field-${c.field}-error`) || html.includes('role="alert"')).toBe(true);
			expect(await tableCounts()).toEqual(before);
		});
	}
});
