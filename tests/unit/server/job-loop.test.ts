import { describe, expect, it } from 'vitest';
import { runJobLoop, type JobSource } from '../../../src/lib/server/jobs';

/** A queue whose database calls can be made to fail, as while PostgreSQL restarts. */
function flakyQueue(jobs: { id: string; data: { n: number } }[]) {
	const calls = { completed: [] as string[], failed: [] as string[], down: false };
	const source: JobSource<{ n: number }> = {
		async fetch(batchSize) {
			if (calls.down) throw new Error('connect ECONNREFUSED');
			return jobs.splice(0, batchSize);
		},
		async complete(id) {
			if (calls.down) throw new Error('terminating connection due to administrator command');
			calls.completed.push(id);
		},
		async fail(id) {
			if (calls.down) throw new Error('connect ECONNREFUSED');
			calls.failed.push(id);
		}
	};
	return { source, calls };
}

const until = async (check: () => boolean) => {
	for (let i = 0; i < 200 && !check(); i++) await new Promise((r) => setTimeout(r, 5));
	expect(check()).toBe(true);
};

describe('runJobLoop (the worker loop that survives a database restart)', () => {
	it('completes handled jobs and fails the ones whose handler throws', async () => {
		const { source, calls } = flakyQueue([1, 2, 3].map((n) => ({ id: `j${n}`, data: { n } })));
		const loop = runJobLoop(source, async ({ n }) => void (n === 2 && (() => { throw new Error('no'); })()), { batchSize: 2, pollMs: 5, log: () => {} });
		await until(() => calls.completed.length + calls.failed.length === 3);
		await loop.stop();
		expect(calls).toMatchObject({ completed: ['j1', 'j3'], failed: ['j2'] });
	});

	it('a complete or fail that rejects while the database is down is logged, not thrown, and the loop keeps polling', async () => {
		const queue = [{ id: 'a', data: { n: 1 } }, { id: 'b', data: { n: 2 } }];
		const { source, calls } = flakyQueue(queue);
		const lines: string[] = [];
		const handled: number[] = [];
		const unhandled: unknown[] = [];
		const onUnhandled = (e: unknown) => unhandled.push(e);
		process.on('unhandledRejection', onUnhandled);
		const loop = runJobLoop(
			source,
			async ({ n }) => {
				handled.push(n);
				if (n <= 2) calls.down = true; // the database goes away while these jobs run
				if (n === 2) throw new Error('mark sent failed');
			},
			{ batchSize: 1, pollMs: 5, log: (l) => lines.push(l) }
		);
		await until(() => handled.length === 1 && lines.some((l) => l.includes('fetch failed')));
		expect(lines.some((l) => l.includes('complete failed'))).toBe(true);
		calls.down = false; // back up: the loop picks the next job by itself
		await until(() => handled.length === 2 && lines.some((l) => l.includes('fail failed')));
		calls.down = false;
		expect(calls.completed).toEqual([]);
		queue.push({ id: 'c', data: { n: 3 } });
		await until(() => calls.completed.includes('c'));
		await loop.stop();
		process.off('unhandledRejection', onUnhandled);
		expect(unhandled).toEqual([]);
	});

	it('stop() returns while the loop is waiting between polls', async () => {
		const { source } = flakyQueue([]);
		const loop = runJobLoop(source, async () => {}, { batchSize: 1, pollMs: 60_000, log: () => {} });
		await new Promise((r) => setTimeout(r, 10));
		const started = Date.now();
		await loop.stop();
		expect(Date.now() - started).toBeLessThan(1000);
	});
});
