// Route benchmark: the public calendar route (cached and uncached) beside a bare node:http server
// returning the same bytes, and sign-in latency while a flood of password-hashing requests runs.
// Run: npm run build && npm run bench:routes   (BUILD_DIR=other/build compares another build)
// Uses the project-local PostgreSQL (a scratch database, dropped at the end). Figures are ratios
// within one run; the machine is shared, so absolute numbers vary.
import { spawn } from 'node:child_process';
import http from 'node:http';
import os from 'node:os';
import autocannon from 'autocannon';
import { demoCluster } from '../scripts/pg.mjs';
import { migrateDatabase } from '../scripts/migrate.ts';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../scripts/demo.mjs';

// The seed runs in this process: a scratch database is not production (no claim secret needed).
process.env.BUNCHLINE_ENV ??= 'test';
const DURATION_S = Number(process.env.BENCH_SECONDS ?? 8);
const APP_PORT = 4391;
const BARE_PORT = 4392;
const buildDir = process.env.BUILD_DIR ?? 'build';

const cluster = demoCluster();
cluster.start();
const dbName = `bunchline_bench_${process.pid}`;
cluster.createDatabase(dbName);
const databaseUrl = cluster.url.replace(/\/[^/]+$/, `/${dbName}`);
await migrateDatabase(databaseUrl);
// The seed stores plans through the app's modules, which parse the environment when first
// imported: set it (a scratch database is not production) before loading them.
process.env.DATABASE_URL = databaseUrl;
const { seedDemo } = await import('../scripts/seed.ts');
await seedDemo(databaseUrl);

const origin = `http://127.0.0.1:${APP_PORT}`;
const app = spawn('node', ['scripts/serve.mjs'], {
	stdio: ['ignore', 'ignore', 'inherit'],
	env: { ...process.env, BUILD_DIR: buildDir, DATABASE_URL: databaseUrl, HOST: '127.0.0.1', PORT: String(APP_PORT), ORIGIN: origin, BUNCHLINE_ENV: 'test', API_REQUESTS_PER_MINUTE: '100000000', SMTP_PORT: '2999', ADDRESS_HEADER: 'x-forwarded-for', XFF_DEPTH: '1' }
});
for (let i = 0; ; i++) {
	if (await fetch(`${origin}/planner`, { headers: { 'x-forwarded-for': '192.0.2.1' } }).then((r) => r.ok, () => false)) break;
	if (i > 200) throw new Error('the app did not start');
	await new Promise((r) => setTimeout(r, 250));
}

const query = 'cultivar=grand-nain&ageAtPlantingWeeks=12&climate=south-florida-coast';
const icsPath = `/api/v1/plan-preview.ics?${query}&plantedOn=2026-03-01`;
const first = await fetch(`${origin}${icsPath}`, { headers: { 'x-forwarded-for': '192.0.2.1' } });
const bytes = Buffer.from(await first.arrayBuffer());
const headers = Object.fromEntries([...first.headers].filter(([k]) => ['content-type', 'content-disposition', 'cache-control'].includes(k)));
const bare = http.createServer((_req, res) => res.writeHead(200, headers).end(bytes));
await new Promise((r) => bare.listen(BARE_PORT, '127.0.0.1', r));

function cannon(opts) {
	return new Promise((resolve, reject) =>
		autocannon({ connections: 10, duration: DURATION_S, ...opts, headers: { 'x-forwarded-for': '192.0.2.1', ...opts.headers } }, (err, result) => (err ? reject(err) : resolve(result)))
	);
}

let day = 0;
/** Each request another planting day: nothing comes from the cache. */
const uncachedPath = () => {
	const d = new Date(Date.UTC(2000, 0, 1) + (day++ % 40000) * 86_400_000).toISOString().slice(0, 10);
	return `/api/v1/plan-preview.ics?${query}&plantedOn=${d}`;
};

const rows = [];
const record = (label, r) => rows.push({ label, rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, non2xx: r.non2xx });
record('bare node:http, same bytes', await cannon({ url: `http://127.0.0.1:${BARE_PORT}/` }));
record('calendar, same URL (cached)', await cannon({ url: `${origin}${icsPath}` }));
record('calendar, new inputs each time', await cannon({ url: origin, requests: [{ setupRequest: (req) => ({ ...req, path: uncachedPath() }) }] }));

/** Sign-in as a person would: the median and worst of sequential attempts. */
let shown = 0;
async function signInLatency(n = 12) {
	const times = [];
	const statuses = {};
	for (let i = 0; i < n; i++) {
		const t0 = performance.now();
		const res = await fetch(`${origin}/login?/signin`, {
			method: 'POST',
			redirect: 'manual',
			headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin, 'x-forwarded-for': '198.51.100.7' },
			body: new URLSearchParams({ email: DEMO_ACCOUNTS[3].email, password: DEMO_PASSWORD })
		});
		const body = await res.text();
		statuses[res.status] = (statuses[res.status] ?? 0) + 1;
		if (res.status !== 303 && !shown++) console.error(`sign-in answered ${res.status}: ${body.replace(/<[^>]+>/g, ' ').replace(/\s+/g, ' ').match(/.{0,120}(?:wait|try|busy|error|wrong|again).{0,120}/i)?.[0] ?? body.slice(0, 200)}`);
		times.push(performance.now() - t0);
	}
	times.sort((a, b) => a - b);
	return { median: times[Math.floor(n / 2)], worst: times[n - 1], statuses };
}

/** Sign-in latency while 40 connections flood `opts` for the benchmark's duration. */
async function underFlood(opts) {
	const flood = cannon({ connections: 40, ...opts });
	await new Promise((r) => setTimeout(r, 1500));
	const latency = await signInLatency();
	return { latency, flood: await flood };
}

const quiet = await signInLatency();
// The attack of the penetration test: resets with made-up tokens, 40 at a time; before the fix each
// forced a password hash. Beside it the same flood of plain page views: if the reset costs no more
// than a page, the hashing amplification is gone and what is left is the flood itself.
// The attacker has an address of its own (the app reads it from X-Forwarded-For here, as behind a proxy).
const form = { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin, 'x-forwarded-for': '203.0.113.9' };
const resets = await underFlood({
	url: `${origin}/reset?/choose`,
	method: 'POST',
	// As a browser posts a form (accept: text/html), so the status is the action's own, not 200 with JSON.
	headers: form,
	body: 'token=aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa&password=a+long+enough+phrase+here'
});
const views = await underFlood({ url: `${origin}/login`, headers: { accept: 'text/html', 'x-forwarded-for': '203.0.113.9' } });

const f = (n) => n.toFixed(n < 10 ? 2 : 0);
console.log(`node ${process.version}, ${os.cpus()[0]?.model ?? 'cpu'}, ${os.cpus().length} cores; build: ${buildDir}; ${DURATION_S} s per run, 10 connections\n`);
console.log('| route | requests/s | p50 ms | p99 ms | non-2xx | requests/s ÷ bare |');
console.log('|---|---:|---:|---:|---:|---:|');
for (const r of rows) console.log(`| ${r.label} | ${f(r.rps)} | ${r.p50} | ${r.p99} | ${r.non2xx} | ${(r.rps / rows[0].rps).toFixed(3)} |`);
console.log(`\nSign-in (${DEMO_ACCOUNTS[3].email}), 12 sequential attempts:`);
console.log(`| condition | flood req/s | flood statuses | sign-in statuses | median ms | worst ms | median ÷ quiet |\n|---|---:|---|---|---:|---:|---:|`);
const row = (label, l, fl) =>
	console.log(`| ${label} | ${fl ? f(fl.requests.average) : '—'} | ${fl ? JSON.stringify(fl.statusCodeStats ?? {}) : '—'} | ${JSON.stringify(l.statuses)} | ${f(l.median)} | ${f(l.worst)} | ${(l.median / quiet.median).toFixed(2)} |`);
row('quiet', quiet);
row('during 40 connections of made-up-token resets (POST /reset?/choose)', resets.latency, resets.flood);
row('during 40 connections of page views (GET /login)', views.latency, views.flood);
console.log(`\nreset flood ÷ page-view flood, sign-in median: ${(resets.latency.median / views.latency.median).toFixed(2)}`);

bare.close();
app.kill('SIGTERM');
await new Promise((r) => app.once('exit', r));
cluster.dropDatabase(dbName);
if (cluster.startedHere) cluster.stop();
