// ASVS 2.2.1 (input validated on the server) for every form action: arbitrary strings, huge ones,
// control characters, unicode, wrong and missing fields get a 4xx and change no row; never a 5xx.
import { sql } from 'drizzle-orm';
import fc from 'fast-check';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { ID_MAX } from '../../src/lib/schema/fields';
import { ROLES } from '../../src/lib/schema/auth';
import { adjustSchema, claimSchema, marketDaySchema, moveSchema, receiveSchema, saleIdSchema, saleSchema, waitlistSchema } from '../../src/lib/schema/stock';
import { climateFormSchema, cultivarFormSchema, settingsFormSchema } from '../../src/lib/schema/catalogue';
import { milestoneSchema, plantSettingsFormSchema } from '../../src/lib/schema/plant';
import { askSchema, postSchema } from '../../src/lib/schema/questions';
import { guideSchema } from '../../src/lib/schema/guides';
import { reminderSettingsSchema } from '../../src/lib/schema/delivery';
import { db } from '../../src/lib/server/db';
import { tableCounts } from '../helpers/db';
import { nastyText, schemaKeys } from './fuzz';
import { postForm, signedIn } from './helpers';

fc.configureGlobal({ seed: process.env.FORM_FUZZ_SEED === 'random' ? Date.now() : 20261202, numRuns: 40 });

let owner: string;
let gardener: string;
let staff: string;
/** A demo gardener with claimed plants, and one of those plants and a question on the board. */
let grower: string;
let plantId = 0;
let questionId = 0;

beforeAll(async () => {
	await seedDemo(process.env.DATABASE_URL!);
	owner = await signedIn(DEMO_ACCOUNTS[0].email, DEMO_PASSWORD);
	gardener = await signedIn(DEMO_ACCOUNTS[5].email, DEMO_PASSWORD);
	staff = await signedIn(DEMO_ACCOUNTS[1].email, DEMO_PASSWORD);
	grower = await signedIn(DEMO_ACCOUNTS[3].email, DEMO_PASSWORD);
	[{ id: plantId }] = [...(await db.execute<{ id: number }>(sql`select p.id from plants p join users u on u.id = p.gardener_id where u.email = ${DEMO_ACCOUNTS[3].email} order by p.id limit 1`))];
	[{ id: questionId }] = [...(await db.execute<{ id: number }>(sql`select id from questions order by id limit 1`))];
});
// Fuzzed sign-ins count against this machine's address; later test files sign in from it too.
afterEach(() => db.execute(sql`delete from sign_in_attempts`));

const nasty = nastyText;
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

/** The fields a form schema reads (its zod object's keys), each given any nasty value. */
function fieldsOf(schema: unknown): Record<string, fc.Arbitrary<string>> {
	return Object.fromEntries(schemaKeys(schema).map((k) => [k, nasty]));
}

/** Rows of the sale side, the plants and the board: a refused request adds or removes none. */
async function moreCounts(): Promise<Record<string, number>> {
	const tables = ['stock_batches', 'stock_movements', 'market_days', 'sales', 'plants', 'milestones', 'plan_steps', 'cultivars', 'cultivar_changes', 'climate_profiles', 'waitlist_entries', 'uploads', 'calendar_feeds', 'reminders', 'question_photos', 'plan_changes', 'reminder_preferences'];
	const rows = await db.execute<{ t: string; n: number }>(sql.raw(tables.map((t) => `select '${t}' as t, count(*)::int as n from ${t}`).join(' union all ')));
	return Object.fromEntries([...rows].map((r) => [r.t, r.n]));
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
	{ path: '/settings/account?/password', who: () => gardener, form: formOf({ currentPassword: nasty, password: nasty }) },
	{ path: '/nursery/stall?/sell', who: () => staff, form: formOf(fieldsOf(saleSchema)) },
	{ path: '/nursery/stall?/undo', who: () => staff, form: formOf(fieldsOf(saleIdSchema)) },
	{ path: '/nursery/stock?/receive', who: () => owner, form: formOf(fieldsOf(receiveSchema)) },
	{ path: '/nursery/stock?/adjust', who: () => staff, form: formOf(fieldsOf(adjustSchema)) },
	{ path: '/nursery/stock?/move', who: () => staff, form: formOf(fieldsOf(moveSchema)) },
	{ path: '/nursery/stock?/marketDay', who: () => staff, form: formOf(fieldsOf(marketDaySchema)) },
	{ path: '/nursery/cultivars/new', who: () => owner, form: formOf(fieldsOf(cultivarFormSchema)) },
	{ path: '/nursery/climates', who: () => owner, form: formOf(fieldsOf(climateFormSchema)) },
	{ path: '/nursery/settings', who: () => owner, form: formOf(fieldsOf(settingsFormSchema)) },
	{ path: '/cultivars?/wait', form: formOf(fieldsOf(waitlistSchema)) },
	{ path: '/claim/abcdefghijklmnopqrstuvwxyz234567', who: () => gardener, form: formOf(fieldsOf(claimSchema)) },
	{ path: '/plants/[plant]?/settings', who: () => grower, form: formOf(fieldsOf(plantSettingsFormSchema)) },
	{ path: '/plants/[plant]/log?/log', who: () => grower, form: formOf(fieldsOf(milestoneSchema)) },
	{ path: '/settings?/saveReminders', who: () => grower, form: formOf(fieldsOf(reminderSettingsSchema)) },
	{ path: '/ask', who: () => grower, form: formOf(fieldsOf(askSchema)) },
	{ path: '/questions/[question]?/reply', who: () => grower, form: formOf(fieldsOf(postSchema)) },
	{ path: '/nursery/questions/[question]?/answer', who: () => staff, form: formOf(fieldsOf(postSchema)) },
	{ path: '/nursery/guides/new', who: () => staff, form: formOf(fieldsOf(guideSchema)) }
];

describe('ASVS 2.2.1 every form action under arbitrary input', () => {
	for (const action of ACTIONS) {
		it(`${action.path}: never a 5xx; a refusal changes no row`, { timeout: 180_000 }, async () => {
			await fc.assert(
				fc.asyncProperty(action.form, async (fields) => {
					await jobsSettled();
					const before = { ...(await tableCounts()), ...(await moreCounts()) };
					const path = action.path.replace('[plant]', String(plantId)).replace('[question]', String(questionId));
					const res = await postForm(path, fields, action.who?.());
					expect(res.status, JSON.stringify(fields).slice(0, 300)).toBeLessThan(500);
					if (res.status >= 400) expect({ ...(await tableCounts()), ...(await moreCounts()) }).toEqual(before);
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
	it('a NUL byte in a market day\'s place is a 400 beside the place, not a database error', async () => {
		const before = await moreCounts();
		const res = await postForm('/nursery/stock?/marketDay', { on: '2026-12-05', place: 'Marrowby Quay\u0000' }, staff);
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('control characters');
		expect(await moreCounts()).toEqual(before);
	});
	it('a NUL byte in a stock adjustment\'s reason is a 400 beside the reason, and the count stays', async () => {
		const [{ id }] = [...(await db.execute<{ id: number }>(sql`select id from stock_batches order by on_hand desc limit 1`))];
		const before = await moreCounts();
		const res = await postForm('/nursery/stock?/adjust', { batchId: String(id), change: '-1', reason: 'Broken\u0000 stem' }, staff);
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('control characters');
		expect(await moreCounts()).toEqual(before);
	});
	it('a name longer than its limit is refused with a message, not cut', async () => {
		const res = await postForm('/signup?/create', { name: 'N'.repeat(81), email: 'long@example.test', password: 'lantern moss over the quay' });
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('at most 80 characters');
	});
});
