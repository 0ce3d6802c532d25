/**
 * The iCalendar writer against RFC 5545 §3.1 (folding) and §3.3.11 (TEXT escaping), checked by
 * an independent parser (ical.js): whatever text goes in comes back out unchanged.
 */
import fc from 'fast-check';
import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import { escapeText, foldLine, writeCalendar, type AllDayEvent } from '$lib/ics';

const octets = (s: string) => new TextEncoder().encode(s).length;

function event(summary: string, description: string): AllDayEvent {
	return { uid: 'u-1@bunchline', stamp: new Date(Date.UTC(2026, 2, 1, 8)), start: '2026-03-15', end: '2026-03-16', summary, description, sequence: 2 };
}

function parsedEvent(ics: string) {
	return new ICAL.Component(ICAL.parse(ics)).getFirstSubcomponent('vevent')!;
}

describe('escaping (RFC 5545 §3.3.11)', () => {
	it('backslash, semicolon and comma get a backslash; line breaks become \\n', () => {
		expect(escapeText('a\\b;c,d\ne\r\nf')).toBe('a\\\\b\\;c\\,d\\ne\\nf');
	});
	it('any text survives a round trip through ical.js', () => {
		fc.assert(
			fc.property(fc.string({ unit: 'grapheme', maxLength: 300 }), fc.string({ maxLength: 80 }), (description, summary) => {
				const normalised = description.replace(/\r\n|\r/g, '\n');
				const ev = parsedEvent(writeCalendar({ prodId: '-//T//T//EN', name: 'n' }, [event(summary.replace(/[\r\n]/g, ' '), description)]));
				expect(ev.getFirstPropertyValue('description')).toBe(normalised);
			}),
			{ numRuns: 200 }
		);
	}, 30_000);
});

describe('folding (RFC 5545 §3.1)', () => {
	it('a short ASCII line is left alone', () => expect(foldLine('SUMMARY:Feed')).toBe('SUMMARY:Feed'));
	it('every physical line is at most 75 octets and unfolding restores the line, multi-byte text included', () => {
		fc.assert(
			fc.property(fc.string({ unit: 'binary', maxLength: 300 }), (text) => {
				const line = `DESCRIPTION:${text.replace(/[\r\n]/g, '')}`;
				const folded = foldLine(line);
				return folded.split('\r\n').every((physical) => octets(physical) <= 75) && folded.replace(/\r\n /g, '') === line;
			}),
			{ numRuns: 100 }
		);
	}, 30_000);
	it('a 200-character ASCII line folds into 75 + 74 + 51 characters (the leading space counts)', () => {
		const folded = foldLine('X'.repeat(200)).split('\r\n');
		expect(folded.map((l) => l.length)).toEqual([75, 75, 52]);
		expect(folded.slice(1).every((l) => l.startsWith(' '))).toBe(true);
	});
});

describe('calendar properties', () => {
	const ics = writeCalendar({ prodId: '-//Bunchline//Care plan//EN', name: 'Grand Nain, bed 2', refreshInterval: 'PT12H' }, [event('Feed', 'x')]);
	const calendar = new ICAL.Component(ICAL.parse(ics));
	it('VERSION, PRODID, CALSCALE, METHOD; NAME and REFRESH-INTERVAL (RFC 7986) with X-WR-CALNAME and X-PUBLISHED-TTL', () => {
		expect(calendar.getFirstPropertyValue('version')).toBe('2.0');
		expect(calendar.getFirstPropertyValue('calscale')).toBe('GREGORIAN');
		// ical.js reads NAME and X-WR-CALNAME as unknown (raw) properties: the escaped TEXT shows as written.
		expect(ics).toContain('\r\nNAME:Grand Nain\\, bed 2\r\n');
		expect(calendar.getFirstPropertyValue('x-wr-calname')).toBe('Grand Nain\\, bed 2');
		expect(String(calendar.getFirstPropertyValue('refresh-interval'))).toBe('PT12H');
		expect(ics).toContain('\r\nX-PUBLISHED-TTL:PT12H\r\n');
	});
	it('SEQUENCE and DTSTAMP are written as given; the file ends in CRLF', () => {
		const ev = calendar.getFirstSubcomponent('vevent')!;
		expect(ev.getFirstPropertyValue('sequence')).toBe(2);
		expect(String(ev.getFirstPropertyValue('dtstamp'))).toBe('2026-03-01T08:00:00Z');
		expect(ics.endsWith('END:VCALENDAR\r\n')).toBe(true);
	});
});
