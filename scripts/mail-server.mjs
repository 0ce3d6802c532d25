// The local fake mail service: accepts every message on loopback and writes it to an .eml file.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { SMTPServer } from 'smtp-server';
import { isMainModule } from './main-module.mjs';
import { DEFAULTS, environmentOrExit } from '../src/lib/server/env.js';

/** @param {{ port?: number, dir?: string }} [options] */
export function startMailServer({ port = DEFAULTS.smtpPort, dir = DEFAULTS.mailDir } = {}) {
	const out = resolve(dir);
	mkdirSync(out, { recursive: true });
	let counter = 0;
	const server = new SMTPServer({
		authOptional: true,
		disabledCommands: ['STARTTLS', 'AUTH'],
		logger: false,
		onData(stream, session, callback) {
			const chunks = [];
			stream.on('data', (c) => chunks.push(c));
			stream.on('end', () => {
				const stamp = new Date().toISOString().replace(/[:.]/g, '-');
				const name = `${stamp}-${String(++counter).padStart(4, '0')}.eml`;
				writeFileSync(join(out, name), Buffer.concat(chunks));
				callback();
			});
		}
	});
	return new Promise((resolveStart, reject) => {
		server.once('error', reject);
		server.listen(port, '127.0.0.1', () => resolveStart(server));
	});
}

if (isMainModule(import.meta.url)) {
	const { mail, mailDir: dir } = environmentOrExit();
	const port = mail.port;
	await startMailServer({ port, dir });
	console.log(`Fake mail service on 127.0.0.1:${port}, writing to ${dir}/`);
}
