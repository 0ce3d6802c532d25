/** People, batches and handler calls for the sale-side integration tests. */
import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { expect } from 'vitest';
import { UserFacingError } from '../../../src/lib/server/errors';
import { db } from '../../../src/lib/server/db';
import { users } from '../../../src/lib/server/db/schema';
import { stockService } from '../../../src/lib/server/sale-side';
import { uniqueEmail } from '../../helpers/db';

type Role = 'owner' | 'staff' | 'gardener';
export interface Person {
	id: number;
	email: string;
	name: string;
	role: Role;
	units: 'metric';
	emailVerified: true;
}

export async function person(role: Role): Promise<Person> {
	const email = uniqueEmail(role);
	const [row] = await db.insert(users).values({ email, name: `Test ${role}`, passwordHash: 'not-used', role, emailVerifiedAt: new Date() }).returning();
	return { id: row.id, email, name: row.name, role, units: 'metric', emailVerified: true };
}

type Handler = (event: never) => Response | Promise<Response>;

/** Calls a +server.ts handler as the given person (or signed out), with JSON when a body is given. */
export function callAs(handler: Handler, who: Person | null, path: string, init: { method?: string; body?: unknown; params?: Record<string, string> } = {}) {
	const url = new URL(path, 'http://bunchline.test');
	const request = new Request(url, {
		method: init.method ?? (init.body === undefined ? 'GET' : 'POST'),
		...(init.body === undefined ? {} : { headers: { 'content-type': 'application/json' }, body: JSON.stringify(init.body) })
	});
	return Promise.resolve(handler({ request, url, params: init.params ?? {}, locals: { user: who, session: null } } as never));
}

export const today = () => new Date().toISOString().slice(0, 10);
export const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);

export async function batchOf(count: number, owner: Person, cultivar = 'grand-nain') {
	return stockService.receive({ cultivar, count, pottedOn: daysAgo(84), location: undefined }, owner.id, today());
}

export const newClientId = () => randomUUID();

/** Row counts of the sale side's tables: a refused request leaves them as they were. */
export async function saleCounts(): Promise<Record<string, number>> {
	const rows = await db.execute<{ t: string; n: number }>(sql`
		select 'stock_batches' as t, count(*)::int as n from stock_batches union all
		select 'stock_movements', count(*)::int from stock_movements union all
		select 'sales', count(*)::int from sales union all
		select 'plants', count(*)::int from plants union all
		select 'market_days', count(*)::int from market_days union all
		select 'waitlist_entries', count(*)::int from waitlist_entries union all
		select 'on_hand', coalesce(sum(on_hand), 0)::int from stock_batches union all
		select 'claimed', count(claimed_at)::int from plants`);
	return Object.fromEntries([...rows].map((r) => [r.t, r.n]));
}

export interface ApiError {
	error: { message: string; issues: { path: (string | number)[]; message: string }[] };
}

/** The dotted paths of the issues of a refusal with the expected status. */
export async function refusedFields(res: Response, status = 400): Promise<string[]> {
	const text = await res.text();
	if (res.status !== status) throw new Error(`Expected ${status}, got ${res.status}: ${text}`);
	return (JSON.parse(text) as ApiError).error.issues.map((i) => i.path.join('.'));
}

/** The refusal a service call ends in (failing the test when it succeeds or fails otherwise). */
export async function refusal(p: Promise<unknown>): Promise<UserFacingError> {
	const e = await p.then(() => null, (err) => err);
	expect(e).toBeInstanceOf(UserFacingError);
	return e as UserFacingError;
}
