// A production server stops on SIGTERM within seconds (a process manager can restart it): in-flight
// requests finish, the database pool and the job queue close.
import { spawn } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { testPorts } from '../setup/ports';

async function startAndStop(entry: string[], port: number): Promise<{ stoppedInMs: number; code: number | null; inFlight: number }> {
	const url = `http://127.0.0.1:${port}`;
	const server = spawn('node', entry, {
		stdio: ['ignore', 'ignore', 'inherit'],
		env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), ORIGIN: url, BUNCHLINE_ENV: 'test' }
	});
	const exited = new Promise<number | null>((resolve) => server.once('exit', (code) => resolve(code)));
	for (let i = 0; ; i++) {
		const up = await fetch(`${url}/planner`).then((r) => r.ok, () => false);
		if (up) break;
		if (i > 120) throw new Error(`${entry.join(' ')} did not start`);
		await new Promise((r) => setTimeout(r, 250));
	}
	// A request that touches the database and the queue, still running when the signal comes.
	const inFlight = fetch(`${url}/reset?/request`, {
		method: 'POST',
		headers: { 'content-type': 'application/x-www-form-urlencoded', origin: url },
		body: 'email=shutdown%40example.test'
	}).then((r) => r.status);
	await new Promise((r) => setTimeout(r, 20));
	const t0 = Date.now();
	server.kill('SIGTERM');
	const timer = setTimeout(() => server.kill('SIGKILL'), 20_000);
	const code = await exited;
	clearTimeout(timer);
	return { stoppedInMs: Date.now() - t0, code, inFlight: await inFlight.catch(() => 0) };
}

describe('stopping on SIGTERM', () => {
	it('scripts/serve.mjs, the production server, exits within 10 s and finishes the request in flight', async () => {
		const r = await startAndStop(['scripts/serve.mjs'], testPorts.app + 1);
		expect(r.code).toBe(0);
		expect(r.stoppedInMs).toBeLessThan(10_000);
		expect(r.inFlight).toBe(200);
	});
	it("adapter-node's own build/index.js exits within 10 s too", async () => {
		const r = await startAndStop(['build/index.js'], testPorts.app + 2);
		expect(r.stoppedInMs).toBeLessThan(10_000);
		expect(r.code).not.toBeNull();
	});
});
