// Conditional GET as RFC 9110 §13.1–13.2 describes it.
import { describe, expect, it } from 'vitest';
import { httpDate, notModified } from '$lib/http-cache';

const current = { etag: '"abc"', lastModified: new Date('2026-03-05T09:30:00.750Z') };

describe('If-None-Match (RFC 9110 §13.1.2)', () => {
	it('matches its own tag, a weak form of it, one of a list, and *', () => {
		expect(notModified('"abc"', null, current)).toBe(true);
		expect(notModified('W/"abc"', null, current)).toBe(true);
		expect(notModified('"x", "abc"', null, current)).toBe(true);
		expect(notModified('*', null, current)).toBe(true);
	});
	it('a different tag is modified, and then If-Modified-Since is ignored (§13.2.2)', () => {
		expect(notModified('"abd"', httpDate(new Date('2030-01-01')), current)).toBe(false);
	});
});

describe('If-Modified-Since (RFC 9110 §13.1.3)', () => {
	it('compares at whole seconds: the HTTP date of the last change itself is not modified', () => {
		expect(notModified(null, httpDate(current.lastModified), current)).toBe(true);
		expect(notModified(null, 'Thu, 05 Mar 2026 09:30:01 GMT', current)).toBe(true);
		expect(notModified(null, 'Thu, 05 Mar 2026 09:29:59 GMT', current)).toBe(false);
	});
	it('an unreadable date is ignored, and no validators means a full answer', () => {
		expect(notModified(null, 'yesterday', current)).toBe(false);
		expect(notModified(null, null, current)).toBe(false);
	});
	it('writes IMF-fixdate', () => expect(httpDate(new Date(Date.UTC(1994, 10, 6, 8, 49, 37)))).toBe('Sun, 06 Nov 1994 08:49:37 GMT'));
});
