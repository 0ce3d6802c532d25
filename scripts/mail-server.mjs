// The local fake mail service: accepts every message on loopback and writes it to an .eml file.
// For tests it can be told how to answer (`server.answer(...)`, or FAKE_SMTP_ANSWER for the
// standalone service): 451 (try again later) or 550 (refused for good), for everyone or for one
// recipient, or stall (never answer the message, so the sender times out). It also keeps a list
// of the Message-IDs it accepted, so tests can count copies.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { SMTPServer } from 'smtp-server';
import { isMainModule } from './main-module.mjs';
import { DEFAULTS, environmentOrExit } from '../src/lib/server/env.js';

const REPLIES = {
	451: 'Requested action aborted: try again later',
	550: 'Mailbox unavailable'
};

/**
 * @typedef {{ answer: 'accept' | 451 | 550 | 'stall', to?: string }} Rule
 * @param {{ port?: number, dir?: string, store?: boolean, delayMs?: number }} [options]
 *   store: false keeps nothing on disk (benchmarks); delayMs: pause before accepting each message.
 */
export function startMailServer({ port = DEFAULTS.smtpPort, dir = DEFAULTS.mailDir, store = true, delayMs = 0 } = {}) {
	const out = resolve(dir);
	if (store) mkdirSync(out, { recursive: true });
	let counter = 0;
	/** @type {Rule} */
	let rule = { answer: 'accept' };
	/** @type {{ messageId: string, to: string, headers: string }[]} */
	const accepted = [];
	/** @type {(() => void)[]} */
	const stalled = [];
	const applies = (/** @type {string} */ to) => !rule.to || to.toLowerCase() === rule.to.toLowerCase();
	const refusal = (/** @type {451 | 550} */ code) => Object.assign(new Error(REPLIES[code]), { responseCode: code });

	const server = new SMTPServer({
		authOptional: true,
		disabledCommands: ['STARTTLS', 'AUTH'],
		logger: false,
		size: 10 * 1024 * 1024,
		onRcptTo(address, session, callback) {
			if ((rule.answer === 451 || rule.answer === 550) && applies(address.address)) return callback(refusal(rule.answer));
			callback();
		},
		onData(stream, session, callback) {
			const chunks = [];
			stream.on('data', (c) => chunks.push(c));
			stream.on('end', () => {
				if (rule.answer === 'stall' && session.envelope.rcptTo.some((r) => applies(r.address))) {
					stalled.push(() => callback(refusal(451)));
					return;
				}
				const finish = () => {
					const raw = Buffer.concat(chunks);
					const head = raw.subarray(0, Math.max(0, raw.indexOf('\r\n\r\n'))).toString('utf8');
					const messageId = head.match(/^Message-ID:\s*(<[^>]+>)/im)?.[1] ?? '';
					accepted.push({ messageId, to: session.envelope.rcptTo.map((r) => r.address).join(','), headers: head });
					if (store) {
						const stamp = new Date().toISOString().replace(/[:.]/g, '-');
						writeFileSync(join(out, `${stamp}-${String(++counter).padStart(4, '0')}.eml`), raw);
					}
					callback();
				};
				if (delayMs > 0) setTimeout(finish, delayMs);
				else finish();
			});
		}
	});
	const close = server.close.bind(server);
	Object.assign(server, {
		/** How to answer from now on. @param {Rule} next */
		answer(next) {
			rule = next;
			if (next.answer !== 'stall') stalled.splice(0).forEach((release) => release());
		},
		accepted,
		close(/** @type {() => void} */ done) {
			stalled.splice(0).forEach((release) => release());
			return close(done);
		}
	});
	return new Promise((resolveStart, reject) => {
		server.once('error', reject);
		server.listen(port, '127.0.0.1', () => resolveStart(/** @type {SMTPServer & { answer: (r: Rule) => void, accepted: typeof accepted }} */ (server)));
	});
}

if (isMainModule(import.meta.url)) {
	const { mail, mailDir: dir } = environmentOrExit();
	const port = mail.port;
	// FAKE_SMTP_* steer only this fake service (the reliability tests and the dispatch bench).
	const store = process.env.FAKE_SMTP_STORE !== 'off';
	const server = await startMailServer({ port, dir, store });
	const told = process.env.FAKE_SMTP_ANSWER;
	if (told) server.answer({ answer: told === 'stall' ? 'stall' : told === 'accept' ? 'accept' : /** @type {451 | 550} */ (Number(told)), to: process.env.FAKE_SMTP_TO });
	console.log(`Fake mail service on 127.0.0.1:${port}${store ? `, writing to ${dir}/` : ' (keeping nothing)'}${told ? `, answering ${told}` : ''}`);
}
