// The job worker: sends account e-mail (confirmation, reset, invitation) and reminder e-mail
// (from the reminder table) and the question board's answer e-mail through pg-boss, and keeps
// stored plans up to date (src/lib/server/plans/upkeep.ts, every ten minutes). Safe to run as many copies as needed
// (`npm run worker`; pg-boss hands each job to one worker); `npm start` runs one beside the app.
import { isMainModule } from './main-module.mjs';
import { environmentOrExit } from '../src/lib/server/env.js';

export async function startWorker(options: { planUpkeep?: boolean } = {}): Promise<() => Promise<void>> {
	// Imported here so the environment (DATABASE_URL, SMTP_PORT…) is read once it is final.
	const { consume, QUEUES } = await import('../src/lib/server/jobs');
	const { runAccountMailJob } = await import('../src/lib/server/accounts/mail');
	const { runAnswerMailJob } = await import('../src/lib/server/board/mail');
	const { startReminderWorker } = await import('../src/lib/server/reminders/worker');
	const { startPlanUpkeep } = await import('../src/lib/server/plans/upkeep');
	const { closeDb } = await import('../src/lib/server/db');
	// One job per fetch, so a failed send retries only its own message; four loops keep a burst of
	// sign-ups from queueing the next person's link behind 0.5 s polls.
	await consume(QUEUES.accountMail, runAccountMailJob, { workers: 4 });
	await consume(QUEUES.answerMail, (job: Parameters<typeof runAnswerMailJob>[0]) => runAnswerMailJob(job));
	const stop = await startReminderWorker();
	// Plans written by an older engine are regenerated; each plant's stage and next step, which the
	// nursery's table sorts and filters by, are kept current.
	const stopRefresh = options.planUpkeep === false ? async () => {} : startPlanUpkeep();
	return async () => {
		await stopRefresh();
		await stop();
		await closeDb();
	};
}

if (isMainModule(import.meta.url)) {
	environmentOrExit();
	const stop = await startWorker();
	console.log('Worker waiting for jobs (account e-mail, reminders, answer e-mail)');
	const onSignal = async () => {
		await stop();
		process.exit(0);
	};
	process.on('SIGINT', onSignal);
	process.on('SIGTERM', onSignal);
}
