// ASVS 2.2.1 (input validated on the server) for every form action: arbitrary strings, huge ones,
// control characters, unicode, wrong and missing fields get a 4xx and change no row; never a 5xx.
import { sql } from 'drizzle-orm';
import fc from 'fast-check';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { ID_MAX } from '../../src/lib/schema/fields';
import { ROLES } from '../../src/lib/schema/auth';
import { db } from '../../src/lib/server/db';
import { tableCounts } from '../helpers/db';
import { postForm, signedIn } from './helpers';

fc.configureGlobal({ seed: process.env.FORM_FUZZ_SEED === 'random' ? Date.now() : 20261202, numRuns: 40 });

let owner: string;
let gardener: string;

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	owner = await signedIn(DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
	gardener = await signedIn(DEMO_ACCOUNTS[5].email, DEMO_PASSWORD);
});
// Fuzzed sign-ins count against this machine's address; later test files sign in from it too.
afterEach(() => db.execute(sql`delete from sign_in_attempts`));

const nasty = fc.oneof(
	fc.string(),
	fc.string({ unit: 'grapheme' }),
	fc.string({ unit: 'binary', maxLength: 40 }),
	fc.string({ minLength: 3000, maxLength: 12000 }),
	fc.constantFrom('\u0000', 'a\u0000b', 'Name\u202Egnp.exe', '\r\nBcc: x@evil.test', '<script>alert(1)</script>', "' or 1=1 --", '../../etc/passwd', '%00', '-1', '1e309', String(ID_MAX + 1), '0x10', ' ', '')
);
// No address of a real account: its mail job would write a token row later, in the middle of another run's count.
const email = fc.oneof(nasty, fc.emailAddress(), fc.constantFrom('a@b', 'x@example.test\u0000', 'OWNER@EXAMPLE.TEST '));
const token = fc.oneof(nasty, fc.stringMatching(/^[a-z2-7]{32}$/));
const id = fc.oneof(nasty, fc.integer().map(String), fc.bigInt({ min: 2n ** 31n, max: 2n ** 70n }).map(String));
const role = fc.oneof(nasty, fc.constantFrom(...ROLES, 'Owner', 'admin'));

/** Waits until the worker has run every queued account-mail job: a job writes rows (tokens) after its request answered. */
async function jobsSettled(): Promise<void> {
	for (let i = 0; i < 200; i++) {
		const [{ n }] = [...(await db.execute<{ n: number }>(sql`select count(*)::int as n from pgboss.job where name = 'account-mail' and state in ('created', 'retry', 'active')`))];
		if (n === 0) return;
		await new Promise((r) => setTimeout(r, 100));
	}
	throw new Error('the job queue did not settle');
}

/** A form: some of the expected fields (any value), plus maybe fields nobody expects. */
function formOf(fields: Record<string, fc.Arbitrary<string>>): fc.Arbitrary<Record<string, string>> {
	return fc
		.tuple(fc.record(fields, { requiredKeys: [] }), fc.dictionary(fc.string({ minLength: 1, maxLength: 12 }), nasty, { maxKeys: 3 }))
		.map(([known, extra]) => Object.fromEntries(Object.entries({ ...extra, ...known }).filter((e): e is [string, string] => e[1] !== undefined)));
}

const ACTIONS: { path: string; who?: () => string; form: fc.Arbitrary<Record<string, string>> }[] = [
	{ path: '/login?/signin', form: formOf({ email, password: nasty }) },
	{ path: '/login?/resend', form: formOf({ email }) },
	{ path: '/signup?/create', form: formOf({ name: nasty, email, password: nasty }) },
	{ path: '/signup?/accept', form: formOf({ token, name: nasty, password: nasty }) },
	{ path: '/reset?/request', form: formOf({ email }) },
	{ path: '/reset?/choose', form: formOf({ token, password: nasty }) },
	{ path: '/verify', form: formOf({ token }) },
	{ path: '/nursery/team?/invite', who: () => owner, form: formOf({ email, role }) },
	// Never "confirmed": a confirmed valid change is not a rejected request, and would demote the demo owner.
	{ path: '/nursery/team?/role', who: () => owner, form: formOf({ userId: id, role, confirmed: nasty.filter((v) => v !== 'yes') }) },
	{ path: '/settings/account?/password', who: () => gardener, form: formOf({ currentPassword: nasty, password: nasty }) }
];

describe('ASVS 2.2.1 every form action under arbitrary input', () => {
	for (const action of ACTIONS) {
		it(`${action.path}: never a 5xx; a refusal changes no row`, { timeout: 180_000 }, async () => {
			await fc.assert(
				fc.asyncProperty(action.form, async (fields) => {
					await jobsSettled();
					const before = await tableCounts();
					const res = await postForm(action.path, fields, action.who?.());
					expect(res.status, JSON.stringify(fields).slice(0, 300)).toBeLessThan(500);
					if (res.status >= 400) expect(await tableCounts()).toEqual(before);
				})
			);
		});
	}
});

describe('ASVS 2.2.1 the odd inputs that answered 500', () => {
	it('a NUL byte in a name at sign-up is a 400 beside the name', async () => {
		const res = await postForm('/signup?/create', { name: 'Nul\u0000Byte', email: 'nul@example.test', password: 'lantern moss over the quay' });
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('control characters');
	});
	it('a bidirectional override in a name is refused (it would reach e-mail bodies)', async () => {
		const res = await postForm('/signup?/create', { name: 'Wren\u202Eeman', email: 'bidi@example.test', password: 'lantern moss over the quay' });
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('direction marks');
	});
	it('userId=2147483648 on a role change is a 400, not a database error', async () => {
		const res = await postForm('/nursery/team?/role', { userId: String(ID_MAX + 1), role: 'staff' }, owner);
		expect(res.status).toBe(400);
	});
	it('a name longer than its limit is refused with a message, not cut', async () => {
		const res = await postForm('/signup?/create', { name: 'N'.repeat(81), email: 'long@example.test', password: 'lantern moss over the quay' });
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('at most 80 characters');
	});
});
