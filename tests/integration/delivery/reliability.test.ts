/**
 * The reminder worker under trouble, against a database of its own (so no other worker of the
 * test run touches it) and a fake mail service run here, which can be told to refuse or stall:
 * a SIGKILL mid-batch, temporary and permanent refusals, PostgreSQL restarting mid-dispatch,
 * and two workers at once. Workers are real `scripts/worker.ts` processes with short intervals.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { appendFileSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import postgres from 'postgres';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { cluster } from '../../../scripts/pg.mjs';
import { migrateDatabase } from '../../../scripts/migrate';
import { startMailServer } from '../../../scripts/mail-server.mjs';
import { testPorts } from '../../setup/ports';

type Fake = Awaited<ReturnType<typeof startMailServer>>;

const pg = cluster({ dir: '.data/test', port: testPorts.postgres, database: 'postgres', fast: true });
const dbName = `bunchline_reliability_${process.pid}`;
const url = pg.url.replace(/\/postgres$/, `/${dbName}`);
const smtpPort = testPorts.smtp + 20;
let sql: postgres.Sql;
let fake: Fake;
let mailDir: string;
const workers: ChildProcess[] = [];

const WORKER_ENV = {
	DATABASE_URL: url,
	SMTP_PORT: String(smtpPort),
	BUNCHLINE_ENV: 'test',
	ORIGIN: 'http://127.0.0.1:4999',
	REMINDER_TICK_MS: '250',
	REMINDER_LEASE_MS: '2500',
	REMINDER_RETRY_BASE_MS: '200',
	REMINDER_MAX_ATTEMPTS: '8',
	REMINDER_CONCURRENCY: '4',
	SMTP_TIMEOUT_MS: '1500'
};

function startWorker(): ChildProcess {
	const child = spawn('node', ['--import', 'tsx', 'scripts/worker.ts'], { env: { ...process.env, ...WORKER_ENV }, stdio: ['ignore', 'ignore', 'pipe'] });
	// RELIABILITY_LOG=file keeps the workers' stderr, for finding out why one stopped.
	child.stderr!.on('data', (d) => process.env.RELIABILITY_LOG && appendFileSync(process.env.RELIABILITY_LOG, `[${child.pid}] ${d}`));
	workers.push(child);
	return child;
}

async function stopWorker(child: ChildProcess, signal: NodeJS.Signals = 'SIGTERM') {
	if (child.exitCode !== null || child.signalCode !== null) return;
	await new Promise<void>((done) => {
		child.once('exit', () => done());
		child.kill(signal);
		setTimeout(() => child.kill('SIGKILL'), 8000);
	});
}

async function until(what: string, check: () => Promise<boolean>, ms = 45_000) {
	const end = Date.now() + ms;
	while (Date.now() < end) {
		if (await check().catch(() => false)) return;
		await new Promise((r) => setTimeout(r, 150));
	}
	throw new Error(`timed out waiting for ${what}`);
}

const counts = async () => {
	const rows = await sql<{ state: string; n: number }[]>`select state, count(*)::int as n from reminders group by state`;
	return Object.fromEntries(rows.map((r) => [r.state, r.n])) as Record<string, number>;
};

let gardeners: { id: number; email: string }[] = [];
let stepIds: number[] = [];

/** `n` reminders due now, spread over the gardeners, each tied to a real plan step. */
async function dueReminders(n: number, channel: 'email-step' | 'email-digest' = 'email-step') {
	await sql`delete from reminders`;
	await sql`delete from pgboss.job`.catch(() => {});
	const rows = Array.from({ length: n }, (_, i) => {
		const g = gardeners[i % gardeners.length];
		return { step_id: stepIds[i % stepIds.length], plant_id: g.id === gardeners[0].id ? plantIds[0] : plantIds[1], user_id: g.id, channel, due_at: new Date(Date.now() - 60_000 - i * 1000), title: `Step ${i}` };
	});
	// Each (step, channel, due) is unique: due times differ by a second per row.
	await sql`insert into reminders ${sql(rows)}`;
	fake.accepted.length = 0;
}
let plantIds: number[] = [];

/** Every accepted message's reminder id (from its Message-ID) → how many copies arrived. */
function copiesByMessageId(): Map<string, number> {
	const m = new Map<string, number>();
	for (const a of fake.accepted) m.set(a.messageId, (m.get(a.messageId) ?? 0) + 1);
	return m;
}

beforeAll(async () => {
	pg.createDatabase(dbName);
	await migrateDatabase(url);
	sql = postgres(url, { max: 4, onnotice: () => {} });
	mailDir = mkdtempSync(join(tmpdir(), 'bunchline-reliability-'));
	fake = await startMailServer({ port: smtpPort, dir: mailDir, store: false, delayMs: 15 });
	// Two gardeners with one planted plant each and a stored plan (straight rows, as regeneration writes them).
	for (const name of ['Ada', 'Bo']) {
		const [u] = await sql<{ id: number; email: string }[]>`insert into users (email, name, password_hash, role, email_verified_at)
			values (${`${name.toLowerCase()}.${process.pid}@example.test`}, ${name}, 'x', 'gardener', now()) returning id, email`;
		gardeners.push(u);
		await sql`insert into reminder_preferences (user_id, mode, hour, time_zone, unsubscribe_token) values (${u.id}, 'each-step', 8, 'UTC', ${`unsub${u.id}${process.pid}`})`;
		const [p] = await sql<{ id: number }[]>`insert into plants (cultivar_id, sold_on, age_at_sale_weeks, gardener_id, planted_on, age_at_planting_weeks, units)
			values ((select id from cultivars order by id limit 1), '2026-03-01', 12, ${u.id}, '2026-03-01', 12, 'metric') returning id`;
		plantIds.push(p.id);
		for (let i = 0; i < 3; i++) {
			const [s] = await sql<{ id: number }[]>`insert into plan_steps (plant_id, generation, kind, occurrence, title, detail, earliest, likely, latest, cautions)
				values (${p.id}, 0, 'feeding', ${i}, 'Feed the mat', 'Scatter the feed in a ring.', '2026-04-01', '2026-04-02', '2026-04-03', ${sql.json(['Wear gloves.'])}) returning id`;
			if (p.id === plantIds[0]) stepIds.push(s.id);
		}
	}
}, 120_000);

afterAll(async () => {
	for (const w of workers) await stopWorker(w, 'SIGKILL');
	await sql?.end({ timeout: 2 });
	await new Promise<void>((r) => (fake ? fake.close(() => r()) : r()));
	rmSync(mailDir, { recursive: true, force: true });
	pg.dropDatabase(dbName);
});

beforeEach(() => fake.answer({ answer: 'accept' }));

describe('reminder worker reliability', () => {
	it('SIGKILL mid-batch of 240, then a restart: every reminder ends sent once in the table; copies share their Message-ID and are no more than were in flight', async () => {
		await dueReminders(240);
		const first = startWorker();
		await until('a quarter sent', async () => ((await counts()).sent ?? 0) >= 60);
		first.kill('SIGKILL');
		await new Promise((r) => first.once('exit', r));
		const atKill = await counts();
		const inFlight = atKill.sending ?? 0;
		expect(atKill.sent).toBeLessThan(240);

		const second = startWorker();
		await until('all sent', async () => (await counts()).sent === 240);
		expect(await counts()).toEqual({ sent: 240 });
		const ids = await sql<{ message_id: string }[]>`select message_id from reminders`;
		expect(new Set(ids.map((r) => r.message_id)).size).toBe(240);
		const copies = copiesByMessageId();
		for (const { message_id } of ids) expect(copies.get(message_id), message_id).toBeGreaterThanOrEqual(1);
		expect([...copies.keys()].every((id) => ids.some((r) => r.message_id === id))).toBe(true);
		const doubled = [...copies.values()].filter((n) => n > 1).length;
		expect(doubled).toBeLessThanOrEqual(inFlight);
		expect([...copies.values()].every((n) => n <= 2)).toBe(true);
		await stopWorker(second);
	}, 120_000);

	it('451 for a while, then accepted: everything is delivered and the extra attempts are recorded', async () => {
		fake.answer({ answer: 451 });
		await dueReminders(20);
		const worker = startWorker();
		await until('attempts under 451', async () => {
			const [r] = await sql<{ n: number }[]>`select count(*)::int as n from reminders where attempts >= 2 and last_error like '%451%'`;
			return r.n >= 5;
		});
		fake.answer({ answer: 'accept' });
		await until('all sent', async () => (await counts()).sent === 20);
		const [r] = await sql<{ retried: number }[]>`select count(*)::int as retried from reminders where attempts >= 2`;
		expect(r.retried).toBeGreaterThanOrEqual(5);
		expect(copiesByMessageId().size).toBe(20);
		await stopWorker(worker);
	}, 90_000);

	it('550 for one gardener: those reminders fail with the reason, staff can see it, the other gardener gets everything, and a resend delivers', async () => {
		const refused = gardeners[1];
		fake.answer({ answer: 550, to: refused.email });
		await dueReminders(30);
		const worker = startWorker();
		await until('settled', async () => {
			const c = await counts();
			return (c.sent ?? 0) + (c.failed ?? 0) === 30;
		});
		const rows = await sql<{ user_id: number; state: string; last_error: string | null; attempts: number }[]>`select user_id, state, last_error, attempts from reminders`;
		for (const row of rows) {
			if (row.user_id === refused.id) {
				expect(row.state).toBe('failed');
				expect(row.last_error).toMatch(/550/);
				expect(row.attempts).toBe(1);
			} else expect(row.state).toBe('sent');
		}
		// What the nursery's staff view reads, then its resend: back to due, picked up, delivered.
		fake.answer({ answer: 'accept' });
		const [one] = await sql<{ id: number }[]>`update reminders set state = 'due', retry_at = null, queued_at = null where id = (select id from reminders where state = 'failed' order by id limit 1) returning id`;
		await until('resent', async () => (await sql<{ state: string }[]>`select state from reminders where id = ${one.id}`)[0].state === 'sent');
		await stopWorker(worker);
	}, 90_000);

	it('a stalled mail server times out and the reminders are retried, not lost', async () => {
		fake.answer({ answer: 'stall' });
		await dueReminders(6);
		const worker = startWorker();
		await until('a timeout recorded', async () => {
			const [r] = await sql<{ n: number }[]>`select count(*)::int as n from reminders where last_error is not null`;
			return r.n > 0;
		});
		fake.answer({ answer: 'accept' });
		await until('all sent', async () => (await counts()).sent === 6);
		await stopWorker(worker);
	}, 90_000);

	// pg-boss 10.4.2's work() left complete()/fail() unawaited, so a restart mid-job ended the worker
	// with an unhandled rejection; jobs.ts runs its own loop that awaits them (tests/unit/server/job-loop.test.ts).
	it('PostgreSQL restarted during dispatch: the worker recovers by itself and loses nothing', async () => {
		await dueReminders(200);
		const worker = startWorker();
		await until('dispatch under way', async () => ((await counts()).sent ?? 0) >= 30);
		expect((await counts()).sent).toBeLessThan(200);
		pg.stop();
		await new Promise((r) => setTimeout(r, 1500));
		pg.start();
		await until('all sent after the restart', async () => (await counts()).sent === 200, 100_000);
		expect(worker.exitCode).toBeNull();
		const copies = copiesByMessageId();
		expect(copies.size).toBe(200);
		await stopWorker(worker);
	}, 150_000);

	it('two workers at once send nothing twice', async () => {
		await dueReminders(200);
		const a = startWorker();
		const b = startWorker();
		await until('all sent', async () => (await counts()).sent === 200);
		const copies = copiesByMessageId();
		expect(copies.size).toBe(200);
		expect([...copies.values()].every((n) => n === 1)).toBe(true);
		await Promise.all([stopWorker(a), stopWorker(b)]);
	}, 90_000);
});
