// Builds the app once and serves the production build for the end-to-end tests.
// Runs after setup/database.ts and setup/mail.ts, so it inherits their DATABASE_URL and SMTP_PORT.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import type { TestProject } from 'vitest/node';
import { testPorts } from './ports';

declare module 'vitest' {
	export interface ProvidedContext {
		baseUrl: string;
	}
}

/** Resolves once the server answers; rejects at once if it exits first. */
function waitForServer(server: ChildProcess, url: string, ms: number): Promise<void> {
	return new Promise((resolve, reject) => {
		const until = Date.now() + ms;
		server.once('exit', (code) => reject(new Error(`the app exited (${code}) before answering`)));
		const poll = async () => {
			try {
				if ((await fetch(url)).ok) return resolve();
			} catch {
				/* not up yet */
			}
			if (Date.now() > until) return reject(new Error(`server at ${url} did not start`));
			setTimeout(poll, 250);
		};
		poll();
	});
}

function stop(server: ChildProcess): Promise<void> {
	if (server.exitCode !== null || server.signalCode !== null) return Promise.resolve();
	return new Promise((resolve) => {
		server.once('exit', () => resolve());
		server.kill('SIGTERM');
		setTimeout(() => server.kill('SIGKILL'), 5000);
	});
}

export default async function setup(project: TestProject) {
	const baseUrl = `http://127.0.0.1:${testPorts.app}`;
	if (!process.env.BUNCHLINE_SKIP_BUILD) {
		const build = spawnSync('node', ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'error'], { stdio: 'inherit' });
		if (build.status !== 0) throw new Error('vite build failed');
	}
	const server = spawn('node', ['scripts/serve.mjs'], {
		stdio: ['ignore', 'inherit', 'inherit'],
		// Every browser test and attack posts its forms from this one address; the form limit has its own test.
		env: { ...process.env, HOST: '127.0.0.1', PORT: String(testPorts.app), ORIGIN: baseUrl, BUNCHLINE_ENV: 'test', FORM_POSTS_PER_MINUTE: '1000000' }
	});
	try {
		await waitForServer(server, baseUrl, 30_000);
	} catch (e) {
		await stop(server);
		throw e;
	}
	project.provide('baseUrl', baseUrl);
	return () => stop(server);
}
