// The job worker of a test run: consumes the queues the app fills (account e-mail), as
// scripts/worker.ts does beside `npm start`. Runs after setup/database.ts and setup/mail.ts,
// whose DATABASE_URL, SMTP_PORT and MAIL_DIR it must see, so it is imported only now.
export default async function setup() {
	const { startWorker } = await import('../../scripts/worker');
	const stop = await startWorker();
	return stop;
}
