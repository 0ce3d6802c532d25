/**
 * The job queue: pg-boss 10 on the app's PostgreSQL, for work done outside a request (account
 * e-mail, reminder e-mail and the question board's answer e-mail). Many processes may run it at once; pg-boss hands each job to one
 * of them. The app only sends; scripts/worker.ts consumes. Jobs carry ids and addresses, never
 * secrets: a job that e-mails a link mints the link itself.
 * pg-boss 10 retries nothing by default, so every queue gets a retry limit, backoff and expiry,
 * and errors are logged through an 'error' listener instead of crashing the process.
 */
import PgBoss from 'pg-boss';
import { config } from './config';

const QUEUE_POLICY = { retryLimit: 5, retryDelay: 5, retryBackoff: true, expireInSeconds: 300 } as const;

export const QUEUES = { accountMail: 'account-mail', reminderSend: 'reminder-send', answerMail: 'answer-mail' } as const;
export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

let boss: Promise<PgBoss> | undefined;
/** Only workers run pg-boss's maintenance (expiry, retries, archiving); app instances just send. */
let supervise = false;

function started(): Promise<PgBoss> {
	boss ??= (async () => {
		const b = new PgBoss({ connectionString: config.databaseUrl, schema: 'pgboss', max: supervise ? 4 : 2, supervise, schedule: false });
		b.on('error', (e) => console.error('[jobs]', e.message));
		await b.start();
		for (const name of Object.values(QUEUES)) await b.createQueue(name, { name, ...QUEUE_POLICY });
		return b;
	})().catch((e) => {
		boss = undefined;
		throw e;
	});
	return boss;
}

export async function enqueue<T extends object>(queue: QueueName, data: T): Promise<void> {
	await (await started()).send(queue, data, QUEUE_POLICY);
}

/** Many jobs in one statement. */
export async function enqueueMany<T extends object>(queue: QueueName, data: T[]): Promise<void> {
	if (data.length) await (await started()).insert(data.map((d) => ({ name: queue, data: d, ...QUEUE_POLICY })));
}

export interface ConsumeOptions {
	/** Jobs fetched at once by each worker loop. */
	batchSize?: number;
	/** Parallel worker loops in this process. */
	workers?: number;
	pollingIntervalSeconds?: number;
}

/** What a job loop needs from the queue: pg-boss's fetch, complete and fail for one queue. */
export interface JobSource<T> {
	fetch(batchSize: number): Promise<{ id: string; data: T }[] | null | undefined>;
	complete(id: string): Promise<unknown>;
	fail(id: string, error: { message: string }): Promise<unknown>;
}

export interface JobLoop {
	/** Asks the loop to stop after the jobs in hand and resolves when it has. */
	stop(): Promise<void>;
}

/**
 * One worker loop: fetch, handle, then complete or fail each job, awaiting every call.
 * pg-boss 10.4.2's own `work()` calls complete()/fail() without awaiting them, so when the
 * database goes away mid-job (a restart, a failover) their rejection is unhandled and Node ends
 * the worker process. Here a queue call that fails is logged and the loop carries on polling:
 * the job stays active until its expiry and is then retried by the queue's policy, and the
 * reminder table (not the job) decides what is still to send, so nothing is sent twice or lost.
 */
export function runJobLoop<T>(
	source: JobSource<T>,
	handle: (data: T) => Promise<void>,
	options: { batchSize: number; pollMs: number; log?: (line: string) => void }
): JobLoop {
	const log = options.log ?? ((line: string) => console.error(line));
	let stopping = false;
	let wake: (() => void) | null = null;
	const pause = (ms: number) =>
		new Promise<void>((done) => {
			const timer = setTimeout(() => ((wake = null), done()), ms);
			wake = () => (clearTimeout(timer), (wake = null), done());
		});
	const settle = (what: string, call: Promise<unknown>) => call.catch((e: Error) => log(`[jobs] ${what} failed (the job is retried after its expiry): ${e.message}`));

	const running = (async () => {
		while (!stopping) {
			let jobs: { id: string; data: T }[] = [];
			try {
				jobs = (await source.fetch(options.batchSize)) ?? [];
			} catch (e) {
				log(`[jobs] fetch failed: ${(e as Error).message}`);
			}
			for (const job of jobs) {
				try {
					await handle(job.data);
				} catch (e) {
					await settle('fail', source.fail(job.id, { message: (e as Error)?.message ?? String(e) }));
					continue;
				}
				await settle('complete', source.complete(job.id));
			}
			if (jobs.length === 0 && !stopping) await pause(options.pollMs);
		}
	})();
	return {
		async stop() {
			stopping = true;
			wake?.();
			await running;
		}
	};
}

const loops: JobLoop[] = [];

/**
 * Starts the queue, trying again while the database is unreachable (a worker started during a
 * restart or before PostgreSQL is up waits for it instead of exiting). Gives up after `giveUpMs`.
 */
async function startedPatiently(giveUpMs: number, log: (line: string) => void): Promise<PgBoss> {
	const end = Date.now() + giveUpMs;
	for (let wait = 250; ; wait = Math.min(wait * 2, 5000)) {
		try {
			return await started();
		} catch (e) {
			if (Date.now() + wait > end) throw e;
			log(`[jobs] the queue's database is not reachable (${(e as Error).message}); trying again in ${wait} ms`);
			await new Promise((r) => setTimeout(r, wait));
		}
	}
}

/** Consumes a queue; a handler that throws is retried by the queue's policy. Makes this process a worker. */
export async function consume<T extends object>(queue: QueueName, handle: (data: T) => Promise<void>, options: ConsumeOptions = {}): Promise<void> {
	if (!boss) supervise = true;
	const b = await startedPatiently(120_000, (line) => console.error(line));
	const source: JobSource<T> = {
		fetch: (batchSize) => b.fetch<T>(queue, { batchSize }),
		complete: (id) => b.complete(queue, id),
		fail: (id, error) => b.fail(queue, id, error)
	};
	for (let i = 0; i < (options.workers ?? 1); i++) {
		loops.push(runJobLoop(source, handle, { batchSize: options.batchSize ?? 1, pollMs: (options.pollingIntervalSeconds ?? 0.5) * 1000 }));
	}
}

/** Lets running jobs finish (up to `timeoutMs`) and closes the queue's connections. */
export async function stopJobs(timeoutMs = 5000): Promise<void> {
	if (!boss) return;
	const b = await boss.catch(() => undefined);
	boss = undefined;
	const stopping = Promise.all(loops.splice(0).map((l) => l.stop()));
	await Promise.race([stopping, new Promise((done) => setTimeout(done, timeoutMs).unref())]);
	await b?.stop({ graceful: true, timeout: timeoutMs, wait: true });
}
