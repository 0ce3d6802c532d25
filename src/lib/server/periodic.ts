/**
 * Work a worker repeats on a timer (the reminder tick, plan upkeep): run now and then every
 * `everyMs`, never two runs at once, and a failed run only logged, because the database may be
 * restarting and the next run tries again. Returns the stop, which waits for a run in progress.
 */
export function repeatEvery(everyMs: number, work: () => Promise<void>, failure: string): () => Promise<void> {
	let running: Promise<void> | null = null;
	const run = () => {
		running ??= work()
			.catch((e: Error) => console.error(`${failure}:`, e.message))
			.finally(() => (running = null));
	};
	const timer = setInterval(run, everyMs);
	run();
	return async () => {
		clearInterval(timer);
		await running;
	};
}
