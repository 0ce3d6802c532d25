import { inject } from 'vitest';
import { listMail, type CapturedMail } from '../../src/lib/server/devmail';

/** Waits for the newest message to an address and returns it. */
export async function waitForMail(to: string, subjectPart: string, timeoutMs = 10_000): Promise<CapturedMail> {
	const until = Date.now() + timeoutMs;
	while (Date.now() < until) {
		const found = (await listMail(inject('mailDir'), 1000)).find((m) => m.to.includes(to) && m.subject.includes(subjectPart));
		if (found) return found;
		await new Promise((r) => setTimeout(r, 100));
	}
	throw new Error(`no "${subjectPart}" mail to ${to}`);
}

export function linkIn(mail: CapturedMail): URL {
	const m = mail.body.match(/https?:\/\/\S+/);
	if (!m) throw new Error(`no link in "${mail.subject}"`);
	return new URL(m[0]);
}

/** All messages to an address whose subject contains the text, once at least `atLeast` have arrived. */
export async function waitForAll(to: string, subjectPart: string, atLeast: number, timeoutMs = 10_000): Promise<CapturedMail[]> {
	const until = Date.now() + timeoutMs;
	for (;;) {
		const found = (await listMail(inject('mailDir'), 1000)).filter((m) => m.to.includes(to) && m.subject.includes(subjectPart));
		if (found.length >= atLeast || Date.now() > until) return found;
		await new Promise((r) => setTimeout(r, 100));
	}
}
