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

/** Consumes a queue; a handler that throws is retried by the queue's policy. Makes this process a worker. */
export async function consume<T extends object>(queue: QueueName, handle: (data: T) => Promise<void>, options: ConsumeOptions = {}): Promise<void> {
	if (!boss) supervise = true;
	const b = await started();
	for (let i = 0; i < (options.workers ?? 1); i++) {
		await b.work<T>(queue, { pollingIntervalSeconds: options.pollingIntervalSeconds ?? 0.5, batchSize: options.batchSize ?? 1 }, async (jobs) => {
			for (const job of jobs) await handle(job.data);
		});
	}
}

/** Lets running jobs finish (up to `timeoutMs`) and closes the queue's connections. */
export async function stopJobs(timeoutMs = 5000): Promise<void> {
	if (!boss) return;
	const b = await boss.catch(() => undefined);
	boss = undefined;
	await b?.stop({ graceful: true, timeout: timeoutMs, wait: true });
}
