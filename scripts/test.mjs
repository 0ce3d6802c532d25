// npm test: type check, unit tests, integration tests against a PostgreSQL of the tests' own,
// and end-to-end tests in Debian's chromium against a production build. Stops at the first failure.
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { ensureBinaries } from './pg.mjs';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

function ensureChromium() {
	if (existsSync(CHROMIUM)) return;
	if (process.getuid?.() !== 0) {
		console.error('Chromium is missing: run "sudo apt-get install -y chromium" and try again.');
		process.exit(1);
	}
	console.log("Installing chromium from Debian's packages…");
	const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
	spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
	const r = spawnSync('apt-get', ['install', '-y', '-qq', 'chromium'], { stdio: 'inherit', env });
	if (r.status !== 0 || !existsSync(CHROMIUM)) {
		console.error('Could not install chromium: run "apt-get install -y chromium" and try again.');
		process.exit(1);
	}
}

const stages = [
	['svelte-kit sync', ['svelte-kit', 'sync']],
	['svelte-check', ['svelte-check', '--tsconfig', './tsconfig.json', '--threshold', 'error']],
	['unit tests', ['vitest', 'run', '--project', 'unit']],
	['integration tests', ['vitest', 'run', '--project', 'integration']],
	['end-to-end tests', ['vitest', 'run', '--project', 'e2e']]
];

ensureBinaries();
ensureChromium();
const only = process.argv[2];
for (const [label, args] of stages) {
	if (only && !label.startsWith(only)) continue;
	console.log(`\n== ${label} ==`);
	const r = spawnSync('npx', args, { stdio: 'inherit', env: { ...process.env, FORCE_COLOR: process.env.CI ? '0' : '1' } });
	if (r.status !== 0) {
		console.error(`\n${label} failed`);
		process.exit(r.status ?? 1);
	}
}
console.log('\nAll test stages passed');
