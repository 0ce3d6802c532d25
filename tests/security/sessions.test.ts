// ASVS 7.2.4: a new sign-in ends the session the browser held. ASVS 6.2.2 and 6.2.3: a signed-in
// person changes the password with the current one, and every other session ends.
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo.mjs';
import { seedDemo } from '../../scripts/seed';
import { hashPassword } from '../../src/lib/server/auth/password';
import { db } from '../../src/lib/server/db';
import { users } from '../../src/lib/server/db/schema';
import { uniqueEmail } from '../helpers/db';
import { get, postForm, signedIn } from './helpers';

beforeAll(() => seedDemo(process.env.DATABASE_URL!));

const isSignedIn = async (cookie: string) => (await get('/plants', cookie)).status === 200;

async function personWith(password: string) {
	const email = uniqueEmail('session');
	await db.insert(users).values({ email, name: 'Sam Session', passwordHash: await hashPassword(password), role: 'gardener', emailVerifiedAt: new Date() });
	return email;
}

describe('ASVS 7.2.4 signing in again', () => {
	it('ends the session the browser already held', async () => {
		const first = await signedIn(DEMO_ACCOUNTS[3].email, DEMO_PASSWORD);
		expect(await isSignedIn(first)).toBe(true);
		const second = await signedIn(DEMO_ACCOUNTS[3].email, DEMO_PASSWORD, first);
		expect(second).not.toBe(first);
		expect(await isSignedIn(second)).toBe(true);
		expect(await isSignedIn(first)).toBe(false);
	});
	it('as someone else also ends the earlier person’s session', async () => {
		const pim = await signedIn(DEMO_ACCOUNTS[3].email, DEMO_PASSWORD);
		await signedIn(DEMO_ACCOUNTS[4].email, DEMO_PASSWORD, pim);
		expect(await isSignedIn(pim)).toBe(false);
	});
});

describe('ASVS 6.2.2 and 6.2.3 changing the password while signed in', () => {
	it('needs the current password', async () => {
		const email = await personWith('old mossy stems');
		const cookie = await signedIn(email, 'old mossy stems');
		const res = await postForm('/settings/account?/password', { currentPassword: 'not it at all', password: 'fresh hands of fruit' }, cookie);
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('not your current password');
		await signedIn(email, 'old mossy stems');
	});
	it('refuses a common password with a message beside the field', async () => {
		const email = await personWith('old mossy stems');
		const cookie = await signedIn(email, 'old mossy stems');
		const res = await postForm('/settings/account?/password', { currentPassword: 'old mossy stems', password: 'P@ssw0rd' }, cookie);
		expect(res.status).toBe(400);
		expect(await res.text()).toContain('too easy to guess');
	});
	it('changes it, keeps this session and ends every other one', async () => {
		const email = await personWith('old mossy stems');
		const here = await signedIn(email, 'old mossy stems');
		const elsewhere = await signedIn(email, 'old mossy stems');
		const res = await postForm('/settings/account?/password', { currentPassword: 'old mossy stems', password: 'fresh hands of fruit' }, here);
		expect(res.status).toBe(200);
		expect(await isSignedIn(here)).toBe(true);
		expect(await isSignedIn(elsewhere)).toBe(false);
		await signedIn(email, 'fresh hands of fruit');
		await expect(signedIn(email, 'old mossy stems')).rejects.toThrow();
		const [row] = await db.select().from(users).where(eq(users.email, email));
		expect(row.passwordHash).toMatch(/^\$argon2id\$/);
	});
	it('the account page needs a session', async () => {
		expect((await get('/settings/account')).headers.get('location')).toMatch(/^\/login\?next=/);
	});
});
