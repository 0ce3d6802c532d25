// npm start: PostgreSQL, migrations, demo seed, fake mail service, app and job worker (account e-mail; reminders later).
// npm run dev: the same with vite's hot reload. Ctrl-C stops everything started here, and only that.
import { spawn, spawnSync } from 'node:child_process';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './demo.mjs';
import { demoCluster } from './pg.mjs';
import { DEFAULTS, environmentOrExit } from '../src/lib/server/env.js';

const dev = process.argv.includes('--dev');
// A mistyped variable (BUNCHLINE_ENV=prod, PORT=80a) stops here, before anything starts.
const given = environmentOrExit();
const host = DEFAULTS.host;
const port = given.port ?? (dev ? DEFAULTS.devPort : DEFAULTS.appPort);
const url = `http://${host}:${port}`;
const VITE = 'node_modules/vite/bin/vite.js';

const cluster = demoCluster(given);
const ownsDatabase = !given.externalDatabase;
const children = [];
let stopping = false;

/** Stops the children, then the database if this run started it (a cluster already running is left alone). */
async function shutdown(code = 0) {
	if (stopping) return;
	stopping = true;
	await Promise.all(
		children
			.filter((c) => c.exitCode === null && c.signalCode === null)
			.map(
				(c) =>
					new Promise((done) => {
						c.once('exit', done);
						c.kill('SIGTERM');
						setTimeout(() => (c.kill('SIGKILL'), done()), 8000);
					})
			)
	);
	if (ownsDatabase && cluster.startedHere) cluster.stop();
	console.log('Stopped.');
	process.exit(code);
}
// Installed before anything starts, so Ctrl-C during the build also stops the database.
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(signal, () => shutdown(0));

if (ownsDatabase) {
	console.log('Starting PostgreSQL…');
	try {
		cluster.start();
	} catch (e) {
		console.error(e instanceof Error ? e.message : e);
		process.exit(1);
	}
}

const env = {
	...process.env,
	DATABASE_URL: given.databaseUrl,
	SMTP_PORT: String(given.mail.port),
	MAIL_DIR: given.mailDir,
	BUNCHLINE_ENV: process.env.BUNCHLINE_ENV || (dev ? 'development' : 'demo'),
	ORIGIN: url,
	HOST: host,
	PORT: String(port)
};

function step(label, args) {
	if (stopping) return;
	console.log(label);
	const r = spawnSync('node', args, { stdio: 'inherit', env });
	if (r.status !== 0) {
		console.error(`${label.replace(/…$/, '')} ${r.signal ? `stopped by ${r.signal}` : 'failed'}`);
		shutdown(r.status ?? 1);
	}
}

step('Applying migrations…', ['--import', 'tsx', 'scripts/migrate.ts']);
step('Seeding the demo scenario…', ['--import', 'tsx', 'scripts/seed.ts']);
if (!dev) step('Building the app…', [VITE, 'build', '--logLevel', 'warn']);

function launch(name, args) {
	if (stopping) return;
	const child = spawn('node', args, { stdio: 'inherit', env });
	const fail = (why) => {
		if (stopping) return;
		console.error(`${name} ${why}; shutting down`);
		shutdown(1);
	};
	child.on('error', (e) => fail(`could not start (${e.message})`));
	child.on('exit', (code, signal) => fail(`stopped (${signal ?? code})`));
	children.push(child);
}

launch('mail service', ['scripts/mail-server.mjs']);
// node --import tsx keeps the worker one process, so the stop signal reaches it directly.
launch('job worker', ['--import', 'tsx', 'scripts/worker.ts']);
launch('app', dev ? [VITE, 'dev', '--host', host, '--port', String(port), '--strictPort'] : ['scripts/serve.mjs']);

setTimeout(() => {
	if (stopping) return;
	console.log(`\nBunchline is running at ${url}`);
	console.log(`Captured e-mail: ${url}/dev/mail (sign in as the owner) and ${env.MAIL_DIR}/`);
	console.log(`Demo accounts (password "${DEMO_PASSWORD}"):`);
	for (const a of DEMO_ACCOUNTS) console.log(`  ${a.role.padEnd(9)} ${a.email}  (${a.name})`);
	console.log('Press Ctrl-C to stop.\n');
}, dev ? 2500 : 1500);
