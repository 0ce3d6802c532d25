/**
 * The reminder worker as a process runs it: a pooled SMTP transport, the dispatcher, a tick
 * every REMINDER_TICK_MS, and send jobs consumed from pg-boss. Any number of processes may run
 * it at once (`npm run worker`, and one inside `npm start`).
 */
import nodemailer from 'nodemailer';
import { config } from '../config';
import { consume, enqueueMany, QUEUES, stopJobs } from '../jobs';
import { repeatEvery } from '../periodic';
import { createDispatcher, type Mailer } from './dispatch';
import { reminderRepository } from './repository';

/** The right-hand side of Message-IDs: the sender's domain. */
export function messageDomain(from: string, publicUrl: string): string {
	return from.match(/@([^>\s]+)>?\s*$/)?.[1] ?? new URL(publicUrl).hostname;
}

export function reminderTransport() {
	const { host, port } = config.mail;
	const t = config.reminders.smtpTimeoutMs;
	return nodemailer.createTransport({
		host,
		port,
		secure: false,
		ignoreTLS: host === '127.0.0.1' || host === 'localhost',
		pool: true,
		maxConnections: config.reminders.concurrency,
		maxMessages: Infinity,
		connectionTimeout: t,
		greetingTimeout: t,
		socketTimeout: t
	});
}

export async function startReminderWorker(log: (line: string) => void = (l) => console.log(l)): Promise<() => Promise<void>> {
	const transport = reminderTransport();
	const mailer: Mailer = {
		async send(m) {
			await transport.sendMail({ from: m.from, to: m.to, subject: m.subject, text: m.text, html: m.html, messageId: m.messageId, headers: m.headers, attachments: m.attachments });
		}
	};
	const r = config.reminders;
	const dispatcher = createDispatcher(reminderRepository, mailer, {
		leaseMs: r.leaseMs,
		retryBaseMs: r.retryBaseMs,
		maxAttempts: r.maxAttempts,
		batchSize: 50,
		pickLimit: 5000,
		concurrency: r.concurrency,
		mail: { from: config.mail.from, origin: config.publicUrl },
		messageDomain: messageDomain(config.mail.from, config.publicUrl)
	});
	await consume<{ ids: number[] }>(QUEUES.reminderSend, (job) => dispatcher.send(job.ids), { workers: 2 });

	const stopTicking = repeatEvery(
		r.tickMs,
		async () => {
			const n = await dispatcher.tick((batches) => enqueueMany(QUEUES.reminderSend, batches.map((ids) => ({ ids }))));
			if (n) log(`[reminders] queued ${n}`);
		},
		'[reminders] tick failed'
	);
	return async () => {
		await stopTicking();
		await stopJobs();
		transport.close();
	};
}
