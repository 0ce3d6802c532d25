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

async function waitFor(url: string, ms: number) {
	const until = Date.now() + ms;
	while (Date.now() < until) {
		try {
			if ((await fetch(url)).ok) return;
		} catch {
			/* not up yet */
		}
		await new Promise((r) => setTimeout(r, 250));
	}
	throw new Error(`server at ${url} did not start`);
}

export default async function setup(project: TestProject) {
	const port = testPorts.app;
	const baseUrl = `http://127.0.0.1:${port}`;
	if (!process.env.BUNCHLINE_SKIP_BUILD) {
		const build = spawnSync('npx', ['vite', 'build', '--logLevel', 'error'], { stdio: 'inherit' });
		if (build.status !== 0) throw new Error('vite build failed');
	}
	const server: ChildProcess = spawn('node', ['build/index.js'], {
		stdio: ['ignore', 'inherit', 'inherit'],
		env: {
			...process.env,
			HOST: '127.0.0.1',
			PORT: String(port),
			ORIGIN: baseUrl,
			PUBLIC_URL: baseUrl,
			BUNCHLINE_ENV: 'test'
		}
	});
	await waitFor(baseUrl, 30_000);
	project.provide('baseUrl', baseUrl);
	return async () => {
		server.kill('SIGTERM');
	};
}
