/**
 * The job queue (pg-boss on the app's PostgreSQL), shared by everything that works outside a
 * request: account e-mail today, reminders later. The app only sends; scripts/worker.ts consumes.
 * Jobs carry ids and addresses, never secrets: a job that e-mails a link mints the link itself.
 */
import PgBoss from 'pg-boss';
import { config } from './config';

/** Retries with backoff and an expiry on every queue (pg-boss 10 defaults to no retry at all). */
const QUEUE_POLICY = { retryLimit: 5, retryDelay: 5, retryBackoff: true, expireInSeconds: 120 } as const;

export const QUEUES = { accountMail: 'account-mail', reminders: 'reminders' } as const;
export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

let boss: Promise<PgBoss> | undefined;
/** Only workers run pg-boss's maintenance (expiry, retries, archiving); app instances just send. */
let supervise = false;

function started(): Promise<PgBoss> {
	boss ??= (async () => {
		const b = new PgBoss({ connectionString: config.databaseUrl, schema: 'pgboss', max: supervise ? 4 : 2, supervise, schedule: supervise });
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

/** Consumes a queue; a handler that throws is retried by the queue's policy. Makes this process a worker. */
export async function consume<T extends object>(queue: QueueName, handle: (data: T) => Promise<void>): Promise<void> {
	if (!boss) supervise = true;
	await (await started()).work<T>(queue, { pollingIntervalSeconds: 0.5, batchSize: 1 }, async (jobs) => {
		for (const job of jobs) await handle(job.data);
	});
}

/** Lets running jobs finish (up to `timeoutMs`) and closes the queue's connections. */
export async function stopJobs(timeoutMs = 5000): Promise<void> {
	if (!boss) return;
	const b = await boss.catch(() => undefined);
	boss = undefined;
	await b?.stop({ graceful: true, timeout: timeoutMs, wait: true });
}
