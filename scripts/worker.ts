// The reminder worker: a pg-boss consumer, safe to run as many copies as needed.
// Reminders themselves arrive with the plant pages; for now it keeps the queue ready.
import PgBoss from 'pg-boss';
import { isMainModule } from './main-module.mjs';

export const REMINDER_QUEUE = 'reminders';

export async function startWorker(url: string): Promise<PgBoss> {
	const boss = new PgBoss({ connectionString: url, schema: 'pgboss' });
	boss.on('error', (e) => console.error('[worker]', e.message));
	await boss.start();
	await boss.createQueue(REMINDER_QUEUE, { name: REMINDER_QUEUE, retryLimit: 5, retryBackoff: true, expireInSeconds: 300 });
	await boss.work(REMINDER_QUEUE, async (jobs) => {
		for (const job of jobs) console.log(`[worker] reminder job ${job.id}`);
	});
	return boss;
}

if (isMainModule(import.meta.url)) {
	const url = process.env.DATABASE_URL;
	if (!url) throw new Error('DATABASE_URL is not set');
	const boss = await startWorker(url);
	console.log('Reminder worker waiting for jobs');
	const stop = async () => {
		await boss.stop({ graceful: true, timeout: 5000 });
		process.exit(0);
	};
	process.on('SIGINT', stop);
	process.on('SIGTERM', stop);
}
