// npm start: PostgreSQL, migrations, demo seed, fake mail service, app and reminder worker.
// npm run dev: the same with vite's hot reload. Ctrl-C stops everything started here.
import { spawn, spawnSync } from 'node:child_process';
import { demoCluster } from './pg.mjs';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './demo.mjs';

const dev = process.argv.includes('--dev');
const host = '127.0.0.1';
const port = Number(process.env.PORT ?? (dev ? 5173 : 4173));
const url = `http://${host}:${port}`;
const smtpPort = process.env.SMTP_PORT ?? '2525';

const cluster = demoCluster();
const databaseUrl = process.env.DATABASE_URL ?? cluster.url;
const ownsDatabase = !process.env.DATABASE_URL;
if (ownsDatabase) {
	console.log('Starting PostgreSQL…');
	cluster.start();
}

const env = {
	...process.env,
	DATABASE_URL: databaseUrl,
	SMTP_PORT: smtpPort,
	MAIL_DIR: process.env.MAIL_DIR ?? 'dev-mail',
	BUNCHLINE_ENV: process.env.BUNCHLINE_ENV ?? (dev ? 'development' : 'demo'),
	ORIGIN: url,
	PUBLIC_URL: url,
	HOST: host,
	PORT: String(port)
};

function step(label, cmd, args) {
	console.log(label);
	const r = spawnSync(cmd, args, { stdio: 'inherit', env });
	if (r.status !== 0) {
		console.error(`${label.replace(/…$/, '')} failed`);
		if (ownsDatabase) cluster.stop();
		process.exit(r.status ?? 1);
	}
}

step('Applying migrations…', 'node', ['--import', 'tsx', 'scripts/migrate.ts']);
step('Seeding the demo scenario…', 'node', ['--import', 'tsx', 'scripts/seed.ts']);
const VITE = 'node_modules/vite/bin/vite.js';
if (!dev) step('Building the app…', 'node', [VITE, 'build', '--logLevel', 'warn']);

const children = [];
function launch(name, cmd, args) {
	const child = spawn(cmd, args, { stdio: 'inherit', env });
	child.on('exit', (code, signal) => {
		if (!stopping) {
			console.error(`${name} stopped (${signal ?? code}); shutting down`);
			shutdown(1);
		}
	});
	children.push(child);
}

launch('mail service', 'node', ['scripts/mail-server.mjs']);
// node --import tsx keeps the worker one process, so Ctrl-C reaches it directly.
launch('reminder worker', 'node', ['--import', 'tsx', 'scripts/worker.ts']);
if (dev) launch('app', 'node', [VITE, 'dev', '--host', host, '--port', String(port), '--strictPort']);
else launch('app', 'node', ['build/index.js']);

let stopping = false;
async function shutdown(code = 0) {
	if (stopping) return;
	stopping = true;
	await Promise.all(
		children.filter((c) => c.exitCode === null).map(
			(c) =>
				new Promise((r) => {
					c.once('exit', r);
					c.kill('SIGTERM');
					setTimeout(() => (c.kill('SIGKILL'), r()), 8000);
				})
		)
	);
	if (ownsDatabase) cluster.stop();
	console.log('Stopped.');
	process.exit(code);
}
process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));

setTimeout(() => {
	console.log(`\nBunchline is running at ${url}`);
	console.log(`Captured e-mail: ${url}/dev/mail (sign in as the owner) and ${env.MAIL_DIR}/`);
	console.log(`Demo accounts (password "${DEMO_PASSWORD}"):`);
	for (const a of DEMO_ACCOUNTS) console.log(`  ${a.role.padEnd(9)} ${a.email}  (${a.name})`);
	console.log('Press Ctrl-C to stop.\n');
}, dev ? 2500 : 1500);
