/**
 * Sending reminders: the rules of the worker, with the queue, the table and the mail transport
 * passed in, so each rule can be exercised on its own.
 *
 * 1. A tick picks due reminders (and ones whose worker vanished mid-send) and queues send jobs:
 *    single steps in batches, a weekly digest as one job per gardener and Monday.
 * 2. A send job claims its rows (due → sending), sends each message with its deterministic
 *    Message-ID, and marks the rows sent. A crash between sending and marking leaves the row
 *    "sending"; after the lease it is sent again with the same Message-ID, so receivers can drop
 *    the copy. A row is never claimed by two workers at once, and while a job still works through
 *    its rows it renews their claim (every third of the lease), so only a vanished worker's rows
 *    are taken over, however slowly a busy machine sends.
 * 3. A temporary refusal (4xx, no answer, connection lost) puts the row back as due after a
 *    growing delay; a permanent one (5xx) or the last allowed attempt marks it failed with the
 *    reason, for staff to see and resend. One refusal never holds up the rest of a batch.
 */
import type { MailContext, OutgoingMail } from './message';
import { digestMail, stepReminderMail } from './message';
import type { ClaimedReminder, ReminderRepository } from './repository';

export interface DispatchOptions {
	/** How long a claimed or queued row may sit before another worker takes it over. */
	leaseMs: number;
	/** First retry delay after a temporary refusal; doubles with each attempt. */
	retryBaseMs: number;
	maxAttempts: number;
	/** Reminder ids per send job. */
	batchSize: number;
	/** Rows a tick picks per round. */
	pickLimit: number;
	/** Messages in flight at once per send job. */
	concurrency: number;
	mail: MailContext;
	/** Right-hand side of every Message-ID. */
	messageDomain: string;
}

export interface Mailer {
	send(mail: OutgoingMail): Promise<void>;
}

export type DispatchRepository = Pick<ReminderRepository, 'pickDue' | 'claim' | 'renewClaim' | 'markSent' | 'markRetry' | 'markFailed' | 'markSkipped'>;

/** SMTP answers 4xx for "try again later" and 5xx for "never" (RFC 5321 §4.2.1). */
export function isPermanent(error: unknown): boolean {
	const code = (error as { responseCode?: unknown })?.responseCode;
	return typeof code === 'number' && code >= 500 && code < 600;
}

export function describeError(error: unknown): string {
	const e = error as { response?: string; message?: string; code?: string };
	return (e?.response ?? e?.message ?? String(error)).slice(0, 500);
}

/** Groups picked rows into send jobs; a digest's rows always travel together. */
export function batchesOf(rows: { id: number; user_id: number; channel: string; due_at: string }[], batchSize: number): number[][] {
	const out: number[][] = [];
	let steps: number[] = [];
	const digests = new Map<string, number[]>();
	for (const r of rows) {
		if (r.channel === 'email-digest') {
			const key = `${r.user_id}|${new Date(r.due_at).getTime()}`;
			digests.set(key, [...(digests.get(key) ?? []), r.id]);
		} else {
			steps.push(r.id);
			if (steps.length === batchSize) (out.push(steps), (steps = []));
		}
	}
	if (steps.length) out.push(steps);
	return [...out, ...digests.values()];
}

/** Runs `work` over items with at most `limit` at once. */
async function inParallel<T>(items: T[], limit: number, work: (item: T) => Promise<void>): Promise<void> {
	let next = 0;
	const lanes = Array.from({ length: Math.min(limit, items.length) }, async () => {
		while (next < items.length) await work(items[next++]);
	});
	await Promise.all(lanes);
}

type Reminded = ClaimedReminder & { step: NonNullable<ClaimedReminder['step']> };

export function createDispatcher(repo: DispatchRepository, mailer: Mailer, options: DispatchOptions) {
	async function deliver(ids: number[], mail: OutgoingMail, attempts: number): Promise<void> {
		try {
			await mailer.send(mail);
		} catch (error) {
			const reason = describeError(error);
			if (isPermanent(error)) await repo.markFailed(ids, reason);
			else if (attempts >= options.maxAttempts) await repo.markFailed(ids, `Gave up after ${attempts} attempts: ${reason}`);
			else await repo.markRetry(ids, reason, options.retryBaseMs * 2 ** (attempts - 1));
			return;
		}
		await repo.markSent(ids);
	}

	return {
		/** Queues send jobs for everything due now; returns how many reminders were queued. */
		async tick(queue: (batches: number[][]) => Promise<void>): Promise<number> {
			let total = 0;
			for (;;) {
				const rows = [...(await repo.pickDue(options.pickLimit, options.leaseMs))];
				if (rows.length) await queue(batchesOf(rows, options.batchSize));
				total += rows.length;
				if (rows.length < options.pickLimit) return total;
			}
		},

		/** One send job. */
		async send(ids: number[]): Promise<void> {
			const claimed = await repo.claim(ids, options.leaseMs, options.messageDomain);
			const gone = claimed.filter((r) => r.step === null).map((r) => r.id);
			if (gone.length) await repo.markSkipped(gone, 'The step is no longer in the plan');
			const ready = claimed.filter((r): r is Reminded => r.step !== null);
			const messages: { ids: number[]; mail: OutgoingMail; attempts: number }[] = [];
			const digests = new Map<string, Reminded[]>();
			for (const r of ready) {
				if (r.channel === 'email-digest') digests.set(r.messageId, [...(digests.get(r.messageId) ?? []), r]);
				else messages.push({ ids: [r.id], mail: stepReminderMail(r, options.mail), attempts: r.attempts });
			}
			for (const rows of digests.values()) {
				messages.push({ ids: rows.map((r) => r.id), mail: digestMail(rows, options.mail), attempts: Math.max(...rows.map((r) => r.attempts)) });
			}
			const unsettled = new Set(messages.flatMap((m) => m.ids));
			const renew = setInterval(() => {
				if (unsettled.size) repo.renewClaim([...unsettled]).catch(() => {}); // the lease covers a missed renewal
			}, options.leaseMs / 3);
			try {
				await inParallel(messages, options.concurrency, async (m) => {
					await deliver(m.ids, m.mail, m.attempts);
					for (const id of m.ids) unsettled.delete(id);
				});
			} finally {
				clearInterval(renew);
			}
		}
	};
}

export type Dispatcher = ReturnType<typeof createDispatcher>;
