/**
 * bench/dispatch: reminders through the real worker beside plain nodemailer, and the feed route
 * beside a bare node:http server returning the same bytes — side by side in one run, so the
 * ratios are the figures (this machine is shared; absolute numbers vary, ratios much less).
 *
 *   npm run bench:dispatch            (BENCH_REMINDERS=20000 for a quicker run)
 *
 * Runs on a PostgreSQL cluster of its own under .data/bench (never the demo or test data),
 * a fake mail service that keeps nothing, and the last production build (built if missing).
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { createServer } from 'node:http';
import autocannon from 'autocannon';
import nodemailer from 'nodemailer';
import postgres from 'postgres';
import { cluster } from '../scripts/pg.mjs';
import { migrateDatabase } from '../scripts/migrate';

const offset = parseInt(createHash('sha1').update(process.cwd()).digest('hex').slice(0, 6), 16) % 400;
const PORTS = { pg: 58000 + offset, smtp: 58500 + offset, app: 59000 + offset, bare: 59500 + offset };
const N = Number(process.env.BENCH_REMINDERS ?? 100_000);
const CONCURRENCY = 4;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);

const pg = cluster({ dir: '.data/bench', port: PORTS.pg, database: 'postgres' });
const children: ChildProcess[] = [];
const log = (line: string) => console.log(line);
/** The machine's 1-minute load average, recorded beside every figure: this machine is shared. */
const load = () => loadavg()[0].toFixed(1);
const loads: Record<string, string> = {};

function launch(args: string[], env: Record<string, string>): ChildProcess {
	const child = spawn('node', args, { env: { ...process.env, ...env }, stdio: ['ignore', 'ignore', 'inherit'] });
	children.push(child);
	return child;
}
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function main() {
	pg.start();
	const dbName = 'bench_dispatch';
	pg.dropDatabase(dbName);
	pg.createDatabase(dbName);
	const url = pg.url.replace(/\/postgres$/, `/${dbName}`);
	await migrateDatabase(url);
	process.env.DATABASE_URL = url;
	const origin = `http://127.0.0.1:${PORTS.app}`;
	process.env.ORIGIN = origin;
	const sql = postgres(url, { max: 4, onnotice: () => {} });

	// Gardeners with a planted plant each and its stored three-generation plan, written by the real regeneration.
	const { insertGardener, insertPlant } = await import('../tests/helpers/plants');
	const plants: number[] = [];
	for (let i = 0; i < 20; i++) {
		const g = await insertGardener(`Bench ${i}`);
		plants.push((await insertPlant({ gardenerId: g.id, plantedOn: '2026-03-01' })).id);
	}
	await sql`insert into reminder_preferences (user_id, mode, hour, time_zone, unsubscribe_token)
		select gardener_id, 'each-step', 8, 'UTC', md5(random()::text) from plants on conflict do nothing`;
	// N reminders over the stored steps, parked a day ahead until the clock starts.
	await sql`delete from reminders`;
	await sql`insert into reminders (step_id, plant_id, user_id, channel, due_at, title)
		select s.id, s.plant_id, p.gardener_id, 'email-step', now() + interval '1 day' + g * interval '1 second', s.title
		  from plan_steps s join plants p on p.id = s.plant_id cross join generate_series(1, ${Math.ceil(N / 500)}) g
		 order by g, s.id limit ${N}`;
	log(`${N} reminders over ${plants.length} plants' stored plans`);

	launch(['scripts/mail-server.mjs'], { SMTP_PORT: String(PORTS.smtp), FAKE_SMTP_STORE: 'off' });
	await sleep(1500);

	// 1. Plain nodemailer: the same composed message, N times, same pool size, no database.
	const { stepReminderMail } = await import('../src/lib/server/reminders/message');
	const { reminderRepository } = await import('../src/lib/server/reminders/repository');
	const [sample] = await sql<{ id: number }[]>`select id from reminders order by id limit 1`;
	await sql`update reminders set due_at = now() - interval '1 minute' where id = ${sample.id}`;
	const [claimed] = await reminderRepository.claim([sample.id], 60_000, 'bunchline.test');
	const mail = stepReminderMail(claimed as Parameters<typeof stepReminderMail>[0], { from: 'Bunchline <plans@bunchline.test>', origin });
	await sql`update reminders set state = 'due', attempts = 0, due_at = now() + interval '1 day' where id = ${sample.id}`;
	const transport = nodemailer.createTransport({ host: '127.0.0.1', port: PORTS.smtp, secure: false, ignoreTLS: true, pool: true, maxConnections: CONCURRENCY, maxMessages: Infinity });
	const plainLoad = load();
	let plainStart = performance.now();
	let next = 0;
	await Promise.all(
		Array.from({ length: CONCURRENCY * 2 }, async () => {
			while (next < N) {
				const i = next++;
				await transport.sendMail({ ...mail, messageId: `<plain-${i}@bunchline.test>` });
			}
		})
	);
	const plainRate = N / ((performance.now() - plainStart) / 1000);
	loads.plain = `${plainLoad}→${load()}`;
	transport.close();
	log(`plain nodemailer: ${plainRate.toFixed(0)} messages/s`);

	// 2. The worker: pg-boss, claim, compose, send, mark sent.
	const worker = launch(['--import', 'tsx', 'scripts/worker.ts'], {
		DATABASE_URL: url,
		SMTP_PORT: String(PORTS.smtp),
		ORIGIN: origin,
		BUNCHLINE_ENV: 'test',
		REMINDER_TICK_MS: '500',
		REMINDER_CONCURRENCY: String(CONCURRENCY)
	});
	await sleep(6000);
	const workerLoad = load();
	const started = performance.now();
	await sql`update reminders set due_at = due_at - interval '2 days'`;
	for (;;) {
		const [{ n }] = await sql<{ n: number }[]>`select count(*)::int as n from reminders where state = 'sent'`;
		if (n >= N) break;
		if (worker.exitCode !== null) throw new Error('the worker stopped');
		await sleep(250);
	}
	const dispatchRate = N / ((performance.now() - started) / 1000);
	loads.worker = `${workerLoad}→${load()}`;
	const [{ twice }] = await sql<{ twice: number }[]>`select count(*)::int as twice from reminders where attempts > 1`;
	log(`worker: ${dispatchRate.toFixed(0)} messages/s (${twice} needed a second attempt)`);
	worker.kill('SIGTERM');

	// 3. The feed route of the production build beside node:http with the same bytes.
	if (!existsSync('build/index.js')) spawnSync('node', ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'error'], { stdio: 'inherit' });
	const app = launch(['build/index.js'], { DATABASE_URL: url, HOST: '127.0.0.1', PORT: String(PORTS.app), ORIGIN: origin, BUNCHLINE_ENV: 'test' });
	for (let i = 0; i < 60 && app.exitCode === null; i++) {
		if (await fetch(origin).then((r) => r.ok, () => false)) break;
		await sleep(500);
	}
	const { feeds } = await import('../src/lib/server/feeds/service');
	const [owner] = await sql<{ gardener_id: number }[]>`select gardener_id from plants where id = ${plants[0]}`;
	const feed = await feeds.create(owner.gardener_id, plants[0]);
	const feedUrl = feed.https;
	const first = await fetch(feedUrl);
	const body = await first.text();
	const headers = Object.fromEntries(['content-type', 'cache-control', 'etag', 'last-modified'].map((h) => [h, first.headers.get(h)!]));
	const [{ events }] = await sql<{ events: number }[]>`select count(*)::int as events from plan_steps where plant_id = ${plants[0]}`;
	const bare = createServer((req, res) => {
		if (req.headers['if-none-match'] === headers.etag) return res.writeHead(304, { etag: headers.etag, 'cache-control': headers['cache-control'] }).end();
		res.writeHead(200, headers).end(body);
	});
	await new Promise<void>((r) => bare.listen(PORTS.bare, '127.0.0.1', () => r()));
	const path = new URL(feedUrl).pathname;
	const run = async (port: number, extra: Record<string, string> = {}) => {
		const before = load();
		const average = (await autocannon({ url: `http://127.0.0.1:${port}${path}`, connections: 10, duration: SECONDS, headers: extra })).requests.average;
		loads[`${port}${extra['if-none-match'] ? ' 304' : ''}`] = `${before}→${load()}`;
		return average;
	};
	const routes = {
		app200: await run(PORTS.app),
		bare200: await run(PORTS.bare),
		app304: await run(PORTS.app, { 'if-none-match': headers.etag }),
		bare304: await run(PORTS.bare, { 'if-none-match': headers.etag })
	};
	bare.close();
	await sql.end();

	const r = (a: number, b: number) => (a / b).toFixed(2);
	console.log(`
${new Date().toISOString()}, node ${process.version}, ${cpus().length} cores; load = 1-minute load average at the start→end of each measurement (Bunchline; baseline)

| measure | Bunchline | baseline | ratio | load |
| --- | --- | --- | --- | --- |
| reminders, messages/s (${N}, worker vs plain nodemailer, pool of ${CONCURRENCY}) | ${dispatchRate.toFixed(0)} | ${plainRate.toFixed(0)} | ${r(dispatchRate, plainRate)} | ${loads.worker}; ${loads.plain} |
| feed, requests/s (${events} events, ${body.length} bytes; route vs node:http) | ${routes.app200.toFixed(0)} | ${routes.bare200.toFixed(0)} | ${r(routes.app200, routes.bare200)} | ${loads[PORTS.app]}; ${loads[PORTS.bare]} |
| feed with If-None-Match → 304, requests/s | ${routes.app304.toFixed(0)} | ${routes.bare304.toFixed(0)} | ${r(routes.app304, routes.bare304)} | ${loads[`${PORTS.app} 304`]}; ${loads[`${PORTS.bare} 304`]} |
`);
}

try {
	await main();
} finally {
	for (const c of children) if (c.exitCode === null) c.kill('SIGTERM');
	await sleep(1000);
	pg.stop();
}
process.exit(0);
