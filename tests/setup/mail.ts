// A fake mail service of the tests' own, writing into a temporary folder.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { startMailServer } from '../../scripts/mail-server.mjs';
import { testPorts } from './ports';

declare module 'vitest' {
	export interface ProvidedContext {
		mailDir: string;
	}
}

export default async function setup(project: TestProject) {
	// Each project its own port, so a security run and an end-to-end run never read each other's mail.
	const port = testPorts.smtp + (['integration', 'e2e', 'security'].indexOf(project.name) + 1);
	const mailDir = mkdtempSync(join(tmpdir(), `bunchline-mail-${project.name}-`));
	const server = await startMailServer({ port, dir: mailDir });
	process.env.SMTP_PORT = String(port);
	process.env.MAIL_DIR = mailDir;
	project.provide('mailDir', mailDir);
	return async () => {
		await new Promise<void>((r) => server.close(() => r()));
		rmSync(mailDir, { recursive: true, force: true });
	};
}
