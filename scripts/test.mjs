// npm test: type check, unit tests, integration tests against a PostgreSQL of the tests' own,
// and end-to-end tests in Debian's chromium against a production build. Stops at the first failure.
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { ensureDebianPackage } from './apt.mjs';
import { ensureBinaries } from './pg.mjs';
import { environmentOrExit } from '../src/lib/server/env.js';

// A mistyped variable in the caller's shell stops here, as npm start would.
environmentOrExit();

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

const ensureChromium = () => ensureDebianPackage('chromium', 'Chromium', () => existsSync(CHROMIUM));

const stages = [
	['svelte-kit sync', ['svelte-kit', 'sync']],
	['svelte-check', ['svelte-check', '--tsconfig', './tsconfig.json', '--threshold', 'error']],
	['unit tests', ['vitest', 'run', '--project', 'unit']],
	['integration tests', ['vitest', 'run', '--project', 'integration']],
	// Against a production build, like the end-to-end tests, which then reuse that build.
	['security tests', ['vitest', 'run', '--project', 'security']],
	['end-to-end tests', ['vitest', 'run', '--project', 'e2e']]
];

const only = process.argv[2];
// Only the stages that need them install PostgreSQL and Chromium.
if (!only || /^(integration|security|end)/.test(only)) ensureBinaries();
if (!only || only.startsWith("end")) ensureChromium();
let built = false;
for (const [label, args] of stages) {
	if (only && !label.startsWith(only)) continue;
	console.log(`\n== ${label} ==`);
	const env = { ...process.env, FORCE_COLOR: process.env.CI ? '0' : '1', ...(built ? { BUNCHLINE_SKIP_BUILD: '1' } : {}) };
	const r = spawnSync('npx', args, { stdio: 'inherit', env });
	if (label.startsWith('security')) built = true;
	if (r.status !== 0) {
		console.error(`\n${label} failed`);
		process.exit(r.status ?? 1);
	}
}
console.log('\nAll test stages passed');
