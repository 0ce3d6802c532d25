// The job worker of a test run: consumes the queues the app fills (account e-mail), as
// scripts/worker.ts does beside `npm start`. Runs after setup/database.ts and setup/mail.ts,
// whose DATABASE_URL, SMTP_PORT and MAIL_DIR it must see, so it is imported only now.
export default async function setup() {
	const { startWorker } = await import('../../scripts/worker');
	// Without plan upkeep: table tests write plant rows with the stage and next step they need, and
	// tests/integration/plants/upkeep.test.ts runs the upkeep on its own plants.
	const stop = await startWorker({ planUpkeep: false });
	return stop;
}
