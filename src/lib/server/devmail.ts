import { readdir, readFile, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { config } from './config';

export interface CapturedMail {
	file: string;
	to: string;
	subject: string;
	date: string;
	body: string;
}

const SAFE_NAME = /^[\w.-]+\.eml$/;

function header(raw: string, name: string): string {
	const m = raw.match(new RegExp(`^${name}:\\s*(.*(?:\\r?\\n[ \\t].*)*)`, 'im'));
	return m ? m[1].replace(/\r?\n[ \t]+/g, ' ').trim() : '';
}

/** Only plain text bodies are sent, so undoing quoted-printable is enough to read them. */
function decodeBody(raw: string): string {
	const body = raw.split(/\r?\n\r?\n/).slice(1).join('\n\n');
	if (!/quoted-printable/i.test(raw)) return body;
	return body.replace(/=\r?\n/g, '').replace(/=([0-9A-F]{2})/g, (_, h) => String.fromCharCode(parseInt(h, 16)));
}

export function parseMail(file: string, raw: string): CapturedMail {
	return { file, to: header(raw, 'To'), subject: header(raw, 'Subject'), date: header(raw, 'Date'), body: decodeBody(raw) };
}

export async function listMail(dir = config.mailDir, limit = 200): Promise<CapturedMail[]> {
	const names = (await readdir(dir).catch(() => [] as string[])).filter((n) => SAFE_NAME.test(n));
	// A message removed while the folder is read is skipped, not an error.
	const withTimes = (await Promise.all(names.map(async (n) => ({ n, t: (await stat(join(dir, n)).catch(() => null))?.mtimeMs })))).filter(
		(e): e is { n: string; t: number } => e.t !== undefined
	);
	withTimes.sort((a, b) => b.t - a.t || b.n.localeCompare(a.n));
	const mails = await Promise.all(withTimes.slice(0, limit).map(({ n }) => readMail(n, dir)));
	return mails.filter((m): m is CapturedMail => m !== null);
}

export async function readMail(file: string, dir = config.mailDir): Promise<CapturedMail | null> {
	if (!SAFE_NAME.test(file)) return null;
	const raw = await readFile(join(dir, file), 'utf8').catch(() => null);
	return raw == null ? null : parseMail(file, raw);
}
