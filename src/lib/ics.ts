/**
 * An iCalendar writer (RFC 5545) for what Bunchline publishes: all-day events in a PUBLISH
 * calendar. Written here rather than with a library because serialising is the hot path of every
 * feed render and the usual generator folds lines character by character (tens of milliseconds
 * per plan); this one folds a whole line at once. Pure: no I/O, no clock.
 *
 * - Text values are escaped per §3.3.11: backslash, semicolon and comma get a backslash, line
 *   breaks become the two characters "\n".
 * - Content lines end in CRLF and are folded so no line exceeds 75 octets (§3.1), never inside a
 *   UTF-8 sequence; a continuation line starts with one space, which counts towards its 75.
 */
import type { IsoDate } from './care/types';

export const CRLF = '\r\n';
const MAX_OCTETS = 75;

export function escapeText(value: string): string {
	return value.replace(/[\\;,]/g, (c) => `\\${c}`).replace(/\r\n|\r|\n/g, '\\n');
}

/** Octets of a UTF-8 code point starting with this UTF-16 code unit (surrogate pairs count once, as 4). */
function utf8Octets(code: number): number {
	if (code < 0x80) return 1;
	if (code < 0x800) return 2;
	if (code >= 0xd800 && code <= 0xdbff) return 4;
	if (code >= 0xdc00 && code <= 0xdfff) return 0;
	return 3;
}

function isAscii(line: string): boolean {
	for (let i = 0; i < line.length; i++) if (line.charCodeAt(i) > 0x7f) return false;
	return true;
}

/** One content line, folded, without the final CRLF. */
export function foldLine(line: string): string {
	if (line.length <= MAX_OCTETS && isAscii(line)) return line;
	if (isAscii(line)) {
		const parts = [line.slice(0, MAX_OCTETS)];
		for (let i = MAX_OCTETS; i < line.length; i += MAX_OCTETS - 1) parts.push(' ' + line.slice(i, i + MAX_OCTETS - 1));
		return parts.join(CRLF);
	}
	const parts: string[] = [];
	let start = 0;
	let octets = 0;
	let limit = MAX_OCTETS;
	for (let i = 0; i < line.length; i++) {
		const size = utf8Octets(line.charCodeAt(i));
		if (octets + size > limit) {
			parts.push((parts.length ? ' ' : '') + line.slice(start, i));
			start = i;
			octets = 0;
			limit = MAX_OCTETS - 1;
		}
		octets += size;
	}
	parts.push((parts.length ? ' ' : '') + line.slice(start));
	return parts.join(CRLF);
}

/** 20260102T030405Z */
export function formatUtcStamp(at: Date): string {
	return at.toISOString().replace(/[-:]/g, '').replace(/\.\d{3}/, '');
}

/** 2026-03-15 → 20260315 */
export function formatDateValue(day: IsoDate): string {
	return day.replaceAll('-', '');
}

export interface AllDayEvent {
	uid: string;
	/** DTSTAMP; for a published calendar, when the event last changed (never the request time). */
	stamp: Date;
	/** LAST-MODIFIED, when known. */
	lastModified?: Date;
	/** Raised each time the event moves (§3.8.7.4). */
	sequence?: number;
	start: IsoDate;
	/** Exclusive (§3.6.1): the day after the last day. */
	end: IsoDate;
	summary: string;
	description: string;
	url?: string;
}

export interface CalendarHeader {
	/** PRODID (§3.7.3). */
	prodId: string;
	/** NAME (RFC 7986 §5.1) and X-WR-CALNAME. */
	name: string;
	/** REFRESH-INTERVAL (RFC 7986 §5.7) and X-PUBLISHED-TTL, as an iCalendar duration such as PT12H. */
	refreshInterval?: string;
}

function eventLines(event: AllDayEvent): string[] {
	const lines = [
		'BEGIN:VEVENT',
		`UID:${escapeText(event.uid)}`,
		`DTSTAMP:${formatUtcStamp(event.stamp)}`,
		`DTSTART;VALUE=DATE:${formatDateValue(event.start)}`,
		`DTEND;VALUE=DATE:${formatDateValue(event.end)}`
	];
	if (event.lastModified) lines.push(`LAST-MODIFIED:${formatUtcStamp(event.lastModified)}`);
	if (event.sequence !== undefined) lines.push(`SEQUENCE:${event.sequence}`);
	lines.push(`SUMMARY:${escapeText(event.summary)}`, `DESCRIPTION:${escapeText(event.description)}`);
	// URL is a URI value (§3.3.13), not TEXT: it is written as it is.
	if (event.url) lines.push(`URL;VALUE=URI:${event.url}`);
	// All-day reminders of work to do: shown as free time, not as a day-long appointment.
	lines.push('TRANSP:TRANSPARENT', 'END:VEVENT');
	return lines;
}

export function writeCalendar(header: CalendarHeader, events: readonly AllDayEvent[]): string {
	const lines = ['BEGIN:VCALENDAR', 'VERSION:2.0', `PRODID:${header.prodId}`, 'CALSCALE:GREGORIAN', 'METHOD:PUBLISH'];
	lines.push(`NAME:${escapeText(header.name)}`, `X-WR-CALNAME:${escapeText(header.name)}`);
	if (header.refreshInterval) {
		lines.push(`REFRESH-INTERVAL;VALUE=DURATION:${header.refreshInterval}`, `X-PUBLISHED-TTL:${header.refreshInterval}`);
	}
	for (const event of events) lines.push(...eventLines(event));
	lines.push('END:VCALENDAR');
	return lines.map(foldLine).join(CRLF) + CRLF;
}
