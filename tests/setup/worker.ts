// The job worker of a test run: consumes the queues the app fills (account e-mail), as
// scripts/worker.ts does beside `npm start`. Runs after setup/database.ts and setup/mail.ts,
// whose DATABASE_URL, SMTP_PORT and MAIL_DIR it must see, so it is imported only now.
export default async function setup() {
	const { startWorker } = await import('../../scripts/worker');
	// Without the hourly summary refresh: table tests write plant rows with the stage and next step
	// they need, and tests/integration/plants/summary-refresh.test.ts runs the refresh itself.
	const stop = await startWorker({ summaryRefresh: false });
	return stop;
}
