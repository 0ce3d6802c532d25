/**
 * A reminder as an e-mail: plain text and HTML saying the same thing, the step's calendar event
 * attached, and the headers of RFC 8058 one-click unsubscribe. Pure: no database, no transport.
 */
import { formatDay, formatWindow, generationLabel } from '../../plan-text';
import { storedCalendar, stepDescription, type StoredStep } from '../calendar';
import { plantLabel } from '../feeds/service';
import type { ClaimedReminder } from './repository';

export interface OutgoingMail {
	from: string;
	to: string;
	subject: string;
	text: string;
	html: string;
	messageId: string;
	headers: Record<string, string>;
	attachments: { filename: string; content: string; contentType: string }[];
}

export interface MailContext {
	from: string;
	/** The configured public URL: links in e-mail never come from a request. */
	origin: string;
}

const SAFETY =
	'Plans are general guidance computed from averages. Local rules (fertilizer limits, quarantine areas), product labels and licensed practice come first.';

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

type Reminded = ClaimedReminder & { step: NonNullable<ClaimedReminder['step']> };

function storedStep(r: Reminded): StoredStep {
	return { ...r.step, plantId: r.plantId, plantLabel: plantLabel(r.cultivar, r.plantId) };
}

function links(r: ClaimedReminder, ctx: MailContext) {
	const url = (path: string) => new URL(path, ctx.origin).toString();
	return {
		preferences: url('/settings#reminders'),
		unsubscribe: r.unsubscribeToken ? url(`/unsubscribe/${r.unsubscribeToken}`) : null
	};
}

function stepHtml(r: Reminded, origin: string): string {
	const s = r.step;
	const lines = stepDescription(s, origin, new URL(`/plants/${r.plantId}`, origin).toString()).split('\n');
	const items = lines
		.slice(1)
		.filter((l) => l.trim())
		.map((l) => (l.startsWith('Caution:') ? `<li><strong>${escapeHtml(l)}</strong></li>` : `<li>${escapeHtml(l).replace(/(https?:\/\/\S+)/g, '<a href="$1">$1</a>')}</li>`))
		.join('');
	return `<h2 style="font-size:18px;margin:16px 0 4px">${escapeHtml(s.title)} · ${escapeHtml(plantLabel(r.cultivar, r.plantId))}</h2><p style="margin:0 0 4px">${escapeHtml(lines[0])}</p><ul style="margin:0 0 12px">${items}</ul>`;
}

function wrapHtml(greeting: string, intro: string, body: string, l: ReturnType<typeof links>): string {
	const unsubscribe = l.unsubscribe ? ` · <a href="${l.unsubscribe}">Stop reminder e-mails</a>` : '';
	return `<!doctype html><html lang="en"><body style="font-family:Georgia,serif;color:#2a1d14;max-width:640px">
<p>${escapeHtml(greeting)}</p><p>${escapeHtml(intro)}</p>${body}
<p style="font-size:13px;color:#5a4636">${escapeHtml(SAFETY)}</p>
<p style="font-size:13px"><a href="${l.preferences}">Reminder settings</a>${unsubscribe}</p></body></html>`;
}

function footerText(l: ReturnType<typeof links>): string {
	return ['', '—', SAFETY, '', `Reminder settings: ${l.preferences}`, ...(l.unsubscribe ? [`Stop reminder e-mails: ${l.unsubscribe}`] : [])].join('\n');
}

function unsubscribeHeaders(l: ReturnType<typeof links>): Record<string, string> {
	return l.unsubscribe ? { 'List-Unsubscribe': `<${l.unsubscribe}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' } : {};
}

const calendarAttachment = (filename: string, ics: string) => ({ filename, content: ics, contentType: 'text/calendar; charset=utf-8; method=PUBLISH' });

/** One step's reminder. */
export function stepReminderMail(r: Reminded, ctx: MailContext): OutgoingMail {
	const s = r.step;
	const label = plantLabel(r.cultivar, r.plantId);
	const l = links(r, ctx);
	const greeting = `Hello ${r.name},`;
	const intro =
		s.earliest === s.latest
			? `${generationLabel(s.generation)} of ${label}: this step is for ${formatDay(s.likely)}.`
			: `${generationLabel(s.generation)} of ${label}: the window for this step is ${formatWindow(s)}, most likely ${formatDay(s.likely)}.`;
	const step = storedStep(r);
	const text = [greeting, '', intro, '', s.title, stepDescription(s, ctx.origin, new URL(`/plants/${r.plantId}`, ctx.origin).toString()), footerText(l)].join('\n');
	return {
		from: ctx.from,
		to: r.email,
		subject: `${s.title} · ${label}`,
		text,
		html: wrapHtml(greeting, intro, stepHtml(r, ctx.origin), l),
		messageId: r.messageId,
		headers: unsubscribeHeaders(l),
		attachments: [calendarAttachment('step.ics', storedCalendar([step], { name: `${label} · Bunchline`, origin: ctx.origin, labelPlants: false }))]
	};
}

/** A gardener's weekly digest: every step of that Monday's list, one message. */
export function digestMail(rows: Reminded[], ctx: MailContext): OutgoingMail {
	const first = rows[0];
	const l = links(first, ctx);
	const greeting = `Hello ${first.name},`;
	const intro = `This week in your banana plants: ${rows.length === 1 ? 'one step' : `${rows.length} steps`} whose window opens.`;
	const texts = rows.map((r) => [`${r.step.title} · ${plantLabel(r.cultivar, r.plantId)}`, stepDescription(r.step, ctx.origin, new URL(`/plants/${r.plantId}`, ctx.origin).toString())].join('\n'));
	return {
		from: ctx.from,
		to: first.email,
		subject: `This week for your banana plants: ${rows.map((r) => r.step.title).slice(0, 2).join('; ')}${rows.length > 2 ? ` and ${rows.length - 2} more` : ''}`,
		text: [greeting, '', intro, '', texts.join('\n\n'), footerText(l)].join('\n'),
		html: wrapHtml(greeting, intro, rows.map((r) => stepHtml(r, ctx.origin)).join(''), l),
		messageId: first.messageId,
		headers: unsubscribeHeaders(l),
		attachments: [calendarAttachment('this-week.ics', storedCalendar(rows.map(storedStep), { name: 'This week · Bunchline', origin: ctx.origin, labelPlants: true }))]
	};
}
