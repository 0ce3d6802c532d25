import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { accounts, TOKEN_LIFETIME_MS } from '../../src/lib/server/accounts/service';
import { lucia } from '../../src/lib/server/auth';
import { ARGON2_OPTIONS } from '../../src/lib/server/auth/password';
import { db } from '../../src/lib/server/db';
import { sessions, signInAttempts, users } from '../../src/lib/server/db/schema';
import { UserFacingError } from '../../src/lib/server/errors';
import { tableCounts, uniqueEmail } from '../helpers/db';
import { linkIn, waitForAll, waitForMail } from '../helpers/mail';

let ipCounter = 0;
/** Each sign-up from its own address, so the per-address sign-up limit stays out of the way. */
const nextIp = () => `10.77.${Math.floor(++ipCounter / 250)}.${ipCounter % 250}`;
const password = 'a long enough phrase';

async function signedUpAndVerified(role: 'owner' | 'staff' | 'gardener' = 'gardener') {
	const email = uniqueEmail(role);
	await accounts.signUp({ name: 'Test Person', email, password }, nextIp());
	const token = linkIn(await waitForMail(email, 'Confirm')).searchParams.get('token')!;
	await accounts.verifyEmail(token);
	if (role !== 'gardener') await db.update(users).set({ role }).where(eq(users.email, email));
	const [user] = await db.select().from(users).where(eq(users.email, email));
	return user;
}

async function refusal(p: Promise<unknown>): Promise<UserFacingError> {
	const e = await p.then(() => null, (err) => err);
	expect(e).toBeInstanceOf(UserFacingError);
	return e as UserFacingError;
}

describe('sign-up and verification', () => {
	it('stores an argon2id hash with the OWASP parameters, never the password', async () => {
		const { email } = await signedUpAndVerified();
		const [row] = await db.select().from(users).where(eq(users.email, email));
		// OWASP Password Storage Cheat Sheet: argon2id, m=19456 KiB, t=2, p=1 (PHC string format)
		expect(row.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
		expect(row.passwordHash).not.toContain(password);
		expect(ARGON2_OPTIONS).toMatchObject({ memoryCost: 19456, timeCost: 2, parallelism: 1 });
		expect(row.emailVerifiedAt).not.toBeNull();
	});

	it('a second sign-up with a used e-mail changes no account and tells the owner of the address', async () => {
		const { email, passwordHash } = await signedUpAndVerified();
		const before = await tableCounts();
		await expect(accounts.signUp({ name: 'Again', email, password: 'someone elses phrase' }, nextIp())).resolves.toEqual({ email });
		expect(await tableCounts()).toEqual(before);
		expect((await db.select().from(users).where(eq(users.email, email)))[0].passwordHash).toBe(passwordHash);
		await waitForMail(email, 'Someone tried to open');
	});

	it('a verification link works once', async () => {
		const email = uniqueEmail();
		await accounts.signUp({ name: 'Once', email, password }, nextIp());
		const token = linkIn(await waitForMail(email, 'Confirm')).searchParams.get('token')!;
		await accounts.verifyEmail(token);
		const e = await refusal(accounts.verifyEmail(token));
		expect(e.status).toBe(410);
	});

	it('a verification link expires after 48 hours', async () => {
		const email = uniqueEmail();
		await accounts.signUp({ name: 'Late', email, password }, nextIp());
		const token = linkIn(await waitForMail(email, 'Confirm')).searchParams.get('token')!;
		const later = new Date(Date.now() + TOKEN_LIFETIME_MS['verify-email'] + 1000);
		expect((await refusal(accounts.verifyEmail(token, later))).field).toBe('token');
	});

	it('an unverified account cannot sign in yet', async () => {
		const email = uniqueEmail();
		await accounts.signUp({ name: 'Waiting', email, password }, nextIp());
		const e = await refusal(accounts.signIn({ email, password }, '10.9.9.1'));
		expect(e.field).toBe('email');
		expect(e.status).toBe(403);
	});
});

describe('sign-in', () => {
	it('accepts the right password and refuses a wrong one with the same message for unknown e-mails', async () => {
		const { email } = await signedUpAndVerified();
		expect((await accounts.signIn({ email, password }, '10.0.0.1')).email).toBe(email);
		const wrong = await refusal(accounts.signIn({ email, password: 'not the password' }, '10.0.0.1'));
		const unknown = await refusal(accounts.signIn({ email: uniqueEmail('nobody'), password }, '10.0.0.1'));
		expect(wrong.message).toBe(unknown.message);
	});

	it('failures on an account slow its next attempts down, with the counts in PostgreSQL', async () => {
		const { email } = await signedUpAndVerified();
		const waits: number[] = [];
		const wait = async (ms: number) => void waits.push(ms);
		for (let i = 0; i < 7; i++) await refusal(accounts.signIn({ email, password: 'wrong password' }, `10.1.0.${i}`, { wait }));
		expect((await accounts.signIn({ email, password }, '10.1.0.99', { wait })).email).toBe(email);
		expect(waits).toEqual([0, 0, 0, 0, 0, 250, 500, 1000]);
		// The success forgave the failures.
		expect(await db.select().from(signInAttempts).where(eq(signInAttempts.key, `email:${email}`))).toHaveLength(0);
	});

	it('holds under parallel attempts from one address: at most its limit of passwords is ever checked', async () => {
		const { email } = await signedUpAndVerified();
		const ip = `10.4.${process.pid % 250}.1`;
		const wait = async () => {};
		const results = await Promise.all(
			Array.from({ length: 40 }, (_, i) => accounts.signIn({ email, password: `wrong guess ${i}` }, ip, { wait }).then(() => 200, (e: UserFacingError) => e.status))
		);
		expect(results.filter((s) => s === 400).length).toBeLessThanOrEqual(30);
		expect(results.filter((s) => s === 429).length).toBeGreaterThanOrEqual(10);
	});

	it('is limited per address across e-mails', async () => {
		const ip = `10.2.${process.pid % 250}.7`;
		for (let i = 0; i < 30; i++) await refusal(accounts.signIn({ email: uniqueEmail('spray'), password: 'wrong password' }, ip, { wait: async () => {} }));
		const { email } = await signedUpAndVerified();
		expect((await refusal(accounts.signIn({ email, password }, ip))).status).toBe(429);
	});
});

describe('password reset', () => {
	it('sets the new password, is single use, and ends every session', async () => {
		const user = await signedUpAndVerified();
		await lucia.createSession(user.id, { createdAt: new Date() });
		await lucia.createSession(user.id, { createdAt: new Date() });
		await accounts.requestPasswordReset(user.email, nextIp());
		const token = linkIn(await waitForMail(user.email, 'Reset')).searchParams.get('token')!;
		await accounts.resetPassword({ token, password: 'a brand new phrase' }, nextIp());
		expect(await db.select().from(sessions).where(eq(sessions.userId, user.id))).toHaveLength(0);
		expect((await accounts.signIn({ email: user.email, password: 'a brand new phrase' }, '10.3.0.1')).id).toBe(user.id);
		const reused = await refusal(accounts.resetPassword({ token, password: 'yet another phrase' }, nextIp()));
		expect(reused.status).toBe(410);
	});

	it('a reset link expires after one hour and changes nothing', async () => {
		const user = await signedUpAndVerified();
		await accounts.requestPasswordReset(user.email, nextIp());
		const token = linkIn(await waitForMail(user.email, 'Reset')).searchParams.get('token')!;
		const [before] = await db.select().from(users).where(eq(users.id, user.id));
		const later = new Date(Date.now() + TOKEN_LIFETIME_MS['reset-password'] + 1000);
		await refusal(accounts.resetPassword({ token, password: 'too late phrase' }, nextIp(), later));
		const [after] = await db.select().from(users).where(eq(users.id, user.id));
		expect(after.passwordHash).toBe(before.passwordHash);
	});

	it('a reset ends the other open reset links and forgives earlier failed sign-ins', async () => {
		const user = await signedUpAndVerified();
		for (let i = 0; i < 5; i++) await refusal(accounts.signIn({ email: user.email, password: 'wrong password' }, `10.5.0.${i}`, { wait: async () => {} }));
		await accounts.requestPasswordReset(user.email, nextIp());
		const first = linkIn(await waitForMail(user.email, 'Reset')).searchParams.get('token')!;
		await new Promise((r) => setTimeout(r, 5));
		await accounts.requestPasswordReset(user.email, nextIp());
		const tokens = (await waitForAll(user.email, 'Reset', 2)).map((m) => linkIn(m).searchParams.get('token')!);
		const second = tokens.find((t) => t !== first)!;
		await accounts.resetPassword({ token: second, password: 'the newest phrase' }, nextIp());
		expect((await refusal(accounts.resetPassword({ token: first, password: 'an older link' }, nextIp()))).status).toBe(410);
		expect((await accounts.signIn({ email: user.email, password: 'the newest phrase' }, '10.5.0.9')).id).toBe(user.id);
	});

	it('mails to one address are limited, and the asker is told when none was sent', async () => {
		const user = await signedUpAndVerified();
		const statuses: number[] = [];
		for (let i = 0; i < 14; i++) statuses.push(await accounts.requestPasswordReset(user.email, nextIp()).then(() => 200, (e: UserFacingError) => e.status));
		expect(statuses.filter((s) => s === 200)).toHaveLength(10);
		expect(statuses.slice(10)).toEqual([429, 429, 429, 429]);
		expect((await waitForAll(user.email, 'Reset', 10)).length).toBe(10);
	});

	it('says nothing about unknown e-mails', async () => {
		await expect(accounts.requestPasswordReset(uniqueEmail('ghost'), nextIp())).resolves.toBeUndefined();
	});
});

describe('team and roles', () => {
	it('an invitation creates a verified account with the invited role, once', async () => {
		const owner = await signedUpAndVerified('owner');
		const email = uniqueEmail('newstaff');
		await accounts.invite({ email, role: 'staff' }, owner.id);
		const token = linkIn(await waitForMail(email, 'invites you')).searchParams.get('invite')!;
		const user = await accounts.acceptInvitation({ token, name: 'New Staff', password }, nextIp());
		expect(user.role).toBe('staff');
		expect(user.emailVerifiedAt).not.toBeNull();
		expect((await refusal(accounts.acceptInvitation({ token, name: 'Again', password }, nextIp()))).status).toBe(410);
		expect(await accounts.invitationState(token)).toEqual({ state: 'used' });
	});

	it('an invitation replaces an unconfirmed account someone else may have opened in that name', async () => {
		const owner = await signedUpAndVerified('owner');
		const email = uniqueEmail('squatted');
		await accounts.signUp({ name: 'Not Them', email, password: 'the squatter phrase' }, nextIp());
		const [squatter] = await db.select().from(users).where(eq(users.email, email));
		await lucia.createSession(squatter.id, { createdAt: new Date() });
		await accounts.invite({ email, role: 'staff' }, owner.id);
		const token = linkIn(await waitForMail(email, 'invites you')).searchParams.get('invite')!;
		const user = await accounts.acceptInvitation({ token, name: 'Real Person', password: 'the real phrase' }, nextIp());
		expect(user.id).toBe(squatter.id);
		expect(user.role).toBe('staff');
		expect(await db.select().from(sessions).where(eq(sessions.userId, squatter.id))).toHaveLength(0);
		expect((await refusal(accounts.signIn({ email, password: 'the squatter phrase' }, '10.6.0.1'))).status).toBe(400);
	});

	it('refuses to invite someone already on the team', async () => {
		const owner = await signedUpAndVerified('owner');
		const other = await signedUpAndVerified('staff');
		expect((await refusal(accounts.invite({ email: other.email, role: 'staff' }, owner.id))).field).toBe('email');
	});

	it('a new invitation to the same address replaces the pending one, whose link then says so', async () => {
		const owner = await signedUpAndVerified('owner');
		const email = uniqueEmail('twice');
		await accounts.invite({ email, role: 'staff' }, owner.id);
		const first = linkIn(await waitForMail(email, 'invites you')).searchParams.get('invite')!;
		await accounts.invite({ email, role: 'owner' }, owner.id);
		const links = (await waitForAll(email, 'invites you', 2)).map((m) => linkIn(m).searchParams.get('invite')!);
		const second = links.find((t) => t !== first)!;
		expect(await accounts.invitationState(first)).toEqual({ state: 'replaced' });
		expect((await accounts.invitationState(second)).state).toBe('live');
		expect((await accounts.listOpenInvitations()).filter((i) => i.email === email)).toEqual([expect.objectContaining({ role: 'owner' })]);
		expect((await refusal(accounts.acceptInvitation({ token: first, name: 'Old Link', password }, nextIp()))).message).toContain('newer invitation');
	});

	it('the invitation e-mail names the nursery and the person who sent it', async () => {
		const owner = await signedUpAndVerified('owner');
		const email = uniqueEmail('named');
		await accounts.invite({ email, role: 'staff' }, owner.id);
		const mail = await waitForMail(email, 'invites you');
		expect(mail.subject).toContain(owner.name);
		expect(mail.body).toContain(owner.email);
		expect(mail.body).toMatch(/join the team of .+ on Bunchline as staff/);
	});

	it('the team list holds owners and staff, not gardeners', async () => {
		await signedUpAndVerified();
		const team = await accounts.listTeamPage(1000, 0);
		expect(team.length).toBeGreaterThan(0);
		expect(team.every((p) => p.role === 'owner' || p.role === 'staff')).toBe(true);
		expect(await accounts.countTeam()).toBe(team.length);
	});

	it('changes a role, ends that person\'s sessions, and keeps at least one owner', async () => {
		await db.update(users).set({ role: 'gardener' }).where(eq(users.role, 'owner'));
		const owner = await signedUpAndVerified('owner');
		const person = await signedUpAndVerified();
		await lucia.createSession(person.id, { createdAt: new Date() });
		expect(await accounts.changeRole({ userId: person.id, role: 'staff' }, owner.id)).toEqual({ name: person.name, role: 'staff', self: false });
		const [row] = await db.select().from(users).where(eq(users.id, person.id));
		expect(row.role).toBe('staff');
		expect(await db.select().from(sessions).where(eq(sessions.userId, person.id))).toHaveLength(0);
		const e = await refusal(accounts.changeRole({ userId: owner.id, role: 'gardener' }, owner.id));
		expect(e.field).toBe('role');
	});
});
