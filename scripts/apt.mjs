import { spawnSync } from 'node:child_process';

export const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/**
 * Installs a Debian package when running as root; otherwise, or when that fails, stops with a
 * one-line instruction. `present()` says whether what the package provides is there.
 */
export function ensureDebianPackage(pkg, what, present) {
	if (present()) return;
	if (!isRoot()) {
		console.error(`${what} is missing: run "sudo apt-get install -y ${pkg}" and try again.`);
		process.exit(1);
	}
	console.log(`Installing ${pkg} from Debian's packages…`);
	const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
	spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
	const r = spawnSync('apt-get', ['install', '-y', '-qq', pkg], { stdio: 'inherit', env });
	if (r.status !== 0 || !present()) {
		console.error(`Could not install ${pkg}: run "apt-get install -y ${pkg}" and try again.`);
		process.exit(1);
	}
}
