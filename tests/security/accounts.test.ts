// Attacks on accounts, reproduced against the services with a real PostgreSQL and the job worker.
import * as common from '@zxcvbn-ts/language-common';
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { assessPassword, contextWords } from '../../src/lib/password-strength';
import { accounts } from '../../src/lib/server/accounts/service';
import { hashingLoad, hashPassword, HASHING_SLOTS, inSlot, verifyPassword } from '../../src/lib/server/auth/password';
import { recentSignInFailures } from '../../src/lib/server/auth/rate-limit';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/db/schema';
import { UserFacingError } from '../../src/lib/server/errors';
import { tableCounts, uniqueEmail } from '../helpers/db';
import { linkIn, waitForAll, waitForMail } from '../helpers/mail';

let ipCounter = 0;
const nextIp = () => `10.88.${Math.floor(++ipCounter / 250)}.${ipCounter % 250}`;
const noWait = { wait: async () => {} };
const PASSWORD = 'lantern moss over the quay';

async function verifiedPerson(password = PASSWORD) {
	const email = uniqueEmail('victim');
	const [user] = await db.insert(users).values({ email, name: 'Vic Tim', passwordHash: await hashPassword(password), role: 'gardener', emailVerifiedAt: new Date() }).returning();
	return user;
}

const statusOf = (p: Promise<unknown>) => p.then(() => 200, (e: UserFacingError) => (e instanceof UserFacingError ? e.status : 500));

beforeAll(() => seedDemo(process.env.DATABASE_URL!));

describe('ASVS 6.3.1 and 6.3.5 nobody can lock someone else out', () => {
	it('after six wrong guesses from elsewhere, the owner’s correct password still signs in (slowed, not refused)', async () => {
		const victim = await verifiedPerson();
		const attacker = nextIp();
		for (let i = 0; i < 6; i++) expect(await statusOf(accounts.signIn({ email: victim.email, password: `guess ${i}` }, attacker, noWait))).toBe(400);
		const waits: number[] = [];
		const user = await accounts.signIn({ email: victim.email, password: PASSWORD }, nextIp(), { wait: async (ms) => void waits.push(ms) });
		expect(user.id).toBe(victim.id);
		expect(waits[0]).toBeGreaterThan(0);
		expect(waits[0]).toBeLessThanOrEqual(5000);
	});

	it('guesses refused by the attacker’s own address limit do not count against the account', async () => {
		const victim = await verifiedPerson();
		const attacker = nextIp();
		const statuses = [];
		for (let i = 0; i < 40; i++) statuses.push(await statusOf(accounts.signIn({ email: victim.email, password: `guess ${i}` }, attacker, noWait)));
		expect(statuses.filter((s) => s === 429)).toHaveLength(10);
		expect(await recentSignInFailures(victim.email)).toBe(30);
		expect((await accounts.signIn({ email: victim.email, password: PASSWORD }, nextIp(), noWait)).id).toBe(victim.id);
	});

	it('a stranger asking for resets cannot use up the owner’s own reset mail', async () => {
		const victim = await verifiedPerson();
		const stranger = nextIp();
		const strangerStatuses = [];
		for (let i = 0; i < 5; i++) strangerStatuses.push(await statusOf(accounts.requestPasswordReset(victim.email, stranger)));
		expect(strangerStatuses).toEqual([200, 200, 200, 429, 429]);
		await accounts.requestPasswordReset(victim.email, nextIp());
		expect((await waitForAll(victim.email, 'Reset', 4)).length).toBe(4);
	});

	it('a refused mail request says so plainly, the same for an address with or without an account', async () => {
		const known = await verifiedPerson();
		const unknown = uniqueEmail('nobody');
		const ip = nextIp();
		const messages = [];
		for (const email of [known.email, unknown]) {
			for (let i = 0; i < 3; i++) await accounts.requestPasswordReset(email, ip);
			const e = await accounts.requestPasswordReset(email, ip).catch((x: UserFacingError) => x);
			expect(e).toBeInstanceOf(UserFacingError);
			messages.push([(e as UserFacingError).status, (e as UserFacingError).message]);
		}
		expect(messages[0]).toEqual(messages[1]);
		expect(messages[0][1]).toContain('did not send another');
	});
});

describe('ASVS 6.3.1 password hashing cannot be forced without an account', () => {
	it('a reset with a made-up token is refused before any hashing', async () => {
		const before = hashingLoad().started;
		const results = await Promise.all(
			Array.from({ length: 30 }, (_, i) => statusOf(accounts.resetPassword({ token: `a${String(i).padStart(31, 'a')}`.slice(0, 32), password: 'some new long phrase' }, nextIp())))
		);
		expect(results.every((s) => s === 410)).toBe(true);
		expect(hashingLoad().started).toBe(before);
	});

	it('an invitation acceptance with a made-up token is refused before any hashing', async () => {
		const before = hashingLoad().started;
		expect(await statusOf(accounts.acceptInvitation({ token: 'b'.repeat(32), name: 'Nobody', password: 'some new long phrase' }, nextIp()))).toBe(410);
		expect(hashingLoad().started).toBe(before);
	});

	it('every action that hashes a new password is limited per address', async () => {
		const ip = nextIp();
		const statuses = [];
		for (let i = 0; i < 22; i++) statuses.push(await statusOf(accounts.signUp({ name: 'Flood', email: uniqueEmail('flood'), password: PASSWORD }, ip)));
		expect(statuses.filter((s) => s === 200)).toHaveLength(20);
		expect(statuses.slice(20)).toEqual([429, 429]);
	});

	it('with every hashing slot busy, a sign-in check goes ahead of the waiting new-password hashes', async () => {
		// The queue itself, with timed work instead of real hashes, so the order does not depend on
		// how the machine schedules argon2's threads (completion order did, on a loaded machine).
		const starts: string[] = [];
		const work = (label: string) => () => {
			starts.push(label);
			return new Promise((r) => setTimeout(r, 20));
		};
		const flood = Array.from({ length: HASHING_SLOTS * 4 }, (_, i) => inSlot('new-password', work(`hash ${i}`)));
		const signIn = inSlot('sign-in', work('sign-in'));
		await Promise.all([...flood, signIn]);
		// Without priority it would start last (index HASHING_SLOTS * 4); with it, in the first slot that frees.
		expect(starts.indexOf('sign-in')).toBe(HASHING_SLOTS);
	});

	it('real hashes and checks go through the same slots', async () => {
		const stored = await hashPassword(PASSWORD);
		const before = hashingLoad().started;
		const [ok] = await Promise.all([verifyPassword(stored, PASSWORD), hashPassword('another long phrase')]);
		expect(ok).toBe(true);
		expect(hashingLoad().started - before).toBe(2);
		expect(hashingLoad()).toMatchObject({ running: 0, waiting: 0 });
	});
});

describe('ASVS 6.3.8 no account enumeration', () => {
	it('signing up with a used address answers as for a new one, and mails the owner of the address instead', async () => {
		const existing = await verifiedPerson();
		const before = await tableCounts();
		const used = await accounts.signUp({ name: 'Someone Else', email: existing.email, password: 'a different long phrase' }, nextIp());
		const fresh = uniqueEmail('fresh');
		const created = await accounts.signUp({ name: 'Someone New', email: fresh, password: 'a different long phrase' }, nextIp());
		expect(Object.keys(used)).toEqual(Object.keys(created));
		expect((await tableCounts()).users).toBe(before.users + 1);
		const note = await waitForMail(existing.email, 'Someone tried to open');
		expect(note.body).toContain('/reset');
		await waitForMail(fresh, 'Confirm');
	});

	it('reset and resend requests do the same work for known and unknown addresses: the mail leaves later, from the worker', async () => {
		const known = await verifiedPerson();
		for (const request of [accounts.requestPasswordReset, accounts.resendVerification]) {
			await expect(request(known.email, nextIp())).resolves.toBeUndefined();
			await expect(request(uniqueEmail('ghost'), nextIp())).resolves.toBeUndefined();
		}
		expect(linkIn(await waitForMail(known.email, 'Reset')).pathname).toBe('/reset');
	});
});

describe('ASVS 6.2.4 common and context passwords are refused', () => {
	for (const password of ['P@ssw0rd', '1q2w3e4r', 'qwertyui', 'iloveyou1', DEMO_PASSWORD, 'password123', 'bananas1']) {
		it(`refuses ${password}`, async () => {
			const before = await tableCounts();
			const e = await accounts.signUp({ name: 'Common Choice', email: uniqueEmail('common'), password }, nextIp()).catch((x) => x);
			expect(e).toBeInstanceOf(UserFacingError);
			expect(e.field).toBe('password');
			expect(await tableCounts()).toEqual(before);
		});
	}

	it('refuses the 3,000 most common passwords of 8 characters or more (zxcvbn-ts common list, independent of this project)', { timeout: 180_000 }, () => {
		const list = (common.dictionary['passwords-common'] as string[]).filter((p) => p.length >= 8).slice(0, 3000);
		expect(list.length).toBe(3000);
		const accepted = list.filter((p) => assessPassword(p).acceptable);
		expect(accepted).toEqual([]);
	});

	it('refuses the nursery’s name and the person’s e-mail', async () => {
		const email = uniqueEmail('context');
		expect(assessPassword('kestrelhollow1', contextWords(['Kestrel Hollow Bananas'])).acceptable).toBe(false);
		expect(assessPassword(`${email.split('@')[0]}`, contextWords([email])).acceptable).toBe(false);
		const e = await accounts.signUp({ name: 'Wren Talbridge', email, password: 'Kestrel Hollow Bananas' }, nextIp()).catch((x) => x);
		expect(e.field).toBe('password');
	});

	it('accepts a phrase of a few unusual words', () => {
		expect(assessPassword('lantern moss over the quay').acceptable).toBe(true);
	});

});
