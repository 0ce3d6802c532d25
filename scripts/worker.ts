// The job worker: sends reminder e-mail from the reminder table through pg-boss. Safe to run as
// many copies as needed (`npm run worker`); `npm start` runs one beside the app.
import { isMainModule } from './main-module.mjs';

export async function startWorker(): Promise<() => Promise<void>> {
	// Imported here so the environment (DATABASE_URL, SMTP_PORT…) is read once it is final.
	const { startReminderWorker } = await import('../src/lib/server/reminders/worker');
	const { closeDb } = await import('../src/lib/server/db');
	const stop = await startReminderWorker();
	return async () => {
		await stop();
		await closeDb();
	};
}

if (isMainModule(import.meta.url)) {
	if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
	const stop = await startWorker();
	console.log('Reminder worker waiting for due reminders');
	const onSignal = async () => {
		await stop();
		process.exit(0);
	};
	process.on('SIGINT', onSignal);
	process.on('SIGTERM', onSignal);
}
