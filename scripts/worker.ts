// The job worker: consumes the queues of src/lib/server/jobs.ts. Safe to run as many copies as
// needed (pg-boss hands each job to one worker). Today it sends account e-mail (confirmation,
// reset, invitation) outside the request; reminders arrive with the plant pages and are only logged.
import { isMainModule } from './main-module.mjs';
import { environmentOrExit } from '../src/lib/server/env.js';

export async function startWorker(): Promise<() => Promise<void>> {
	// Imported here so the environment (DATABASE_URL, SMTP_PORT…) is read once it is final.
	const { consume, QUEUES, stopJobs } = await import('../src/lib/server/jobs');
	const { runAccountMailJob } = await import('../src/lib/server/accounts/mail');
	const { closeDb } = await import('../src/lib/server/db');
	await consume(QUEUES.accountMail, runAccountMailJob);
	await consume<{ id?: string }>(QUEUES.reminders, async (job) => console.log(`[worker] reminder job ${JSON.stringify(job)}`));
	return async () => {
		await stopJobs();
		await closeDb();
	};
}

if (isMainModule(import.meta.url)) {
	environmentOrExit();
	const stop = await startWorker();
	console.log('Worker waiting for jobs (account e-mail, reminders)');
	const onSignal = async () => {
		await stop();
		process.exit(0);
	};
	process.on('SIGINT', onSignal);
	process.on('SIGTERM', onSignal);
}
