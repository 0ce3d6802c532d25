import { readdir, readFile, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { config } from './config';

export interface CapturedMail {
	file: string;
	to: string;
	subject: string;
	date: string;
	body: string;
	/** The List-Unsubscribe URL (RFC 2369), when the message has one. */
	unsubscribe: string | null;
}

const SAFE_NAME = /^[\w.-]+\.eml$/;

/** RFC 2047 encoded words (=?UTF-8?Q?…?= / =?UTF-8?B?…?=), as nodemailer writes non-ASCII subjects. */
function decodeWords(value: string): string {
	return value
		.replace(/\?=\s+=\?/g, '?==?')
		.replace(/=\?[\w-]+\?([QqBb])\?([^?]*)\?=/g, (_, kind: string, text: string) =>
			kind.toUpperCase() === 'B'
				? Buffer.from(text, 'base64').toString('utf8')
				: Buffer.from(text.replace(/_/g, ' ').replace(/=([0-9A-F]{2})/gi, (_m, h) => String.fromCharCode(parseInt(h, 16))), 'latin1').toString('utf8')
		);
}

function header(raw: string, name: string): string {
	const m = raw.match(new RegExp(`^${name}:\\s*(.*(?:\\r?\\n[ \\t].*)*)`, 'im'));
	return m ? decodeWords(m[1].replace(/\r?\n[ \t]+/g, ' ').trim()) : '';
}

function decodeTransfer(headers: string, body: string): string {
	if (/^content-transfer-encoding:\s*base64/im.test(headers)) return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
	if (!/^content-transfer-encoding:\s*quoted-printable/im.test(headers)) return body;
	const bytes = body.replace(/=\r?\n/g, '').replace(/=([0-9A-F]{2})/gi, (_, h) => String.fromCharCode(parseInt(h, 16)));
	return Buffer.from(bytes, 'latin1').toString('utf8');
}

const splitHead = (raw: string): [string, string] => {
	const at = raw.search(/\r?\n\r?\n/);
	return at < 0 ? [raw, ''] : [raw.slice(0, at), raw.slice(at).replace(/^\r?\n\r?\n/, '')];
};

/** The plain-text body: the message itself, or the first text/plain part of a multipart one (reminders carry HTML and a calendar too). */
function textBody(raw: string): string {
	const [head, body] = splitHead(raw);
	const boundary = head.match(/boundary="?([^";\r\n]+)"?/i)?.[1];
	if (!/^content-type:\s*multipart\//im.test(head) || !boundary) return decodeTransfer(head, body);
	for (const part of body.split(`--${boundary}`).slice(1)) {
		const text = textBody(part.replace(/^\r?\n/, ''));
		const [partHead] = splitHead(part.replace(/^\r?\n/, ''));
		if (/^content-type:\s*multipart\//im.test(partHead) || /^content-type:\s*text\/plain/im.test(partHead)) if (text.trim()) return text;
	}
	return '';
}

export function parseMail(file: string, raw: string): CapturedMail {
	const unsubscribe = header(raw, 'List-Unsubscribe').match(/<(https?:[^>]+)>/)?.[1] ?? null;
	return { file, to: header(raw, 'To'), subject: header(raw, 'Subject'), date: header(raw, 'Date'), body: textBody(raw), unsubscribe };
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
