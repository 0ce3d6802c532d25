import nodemailer from 'nodemailer';
import { config } from './config';

const transport = nodemailer.createTransport({
	host: config.mail.host,
	port: config.mail.port,
	secure: false,
	ignoreTLS: config.mail.host === '127.0.0.1' || config.mail.host === 'localhost'
});

export interface Message {
	to: string;
	subject: string;
	text: string;
}

export async function sendMail(m: Message): Promise<string> {
	const info = await transport.sendMail({ from: config.mail.from, to: m.to, subject: m.subject, text: m.text });
	return info.messageId;
}

/** Links in e-mail always use the configured public URL, never the request's Host header. */
export const absoluteUrl = (path: string) => new URL(path, config.publicUrl).toString();
