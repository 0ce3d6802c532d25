/**
 * Conditional GET (RFC 9110 §13): whether a client's cached copy is still current. Pure, so the
 * feed route and its tests share one reading of the rules.
 */

/** IMF-fixdate, e.g. "Sun, 06 Nov 1994 08:49:37 GMT" (RFC 9110 §5.6.7). */
export const httpDate = (at: Date): string => at.toUTCString();

/** Weak comparison (§8.8.3.2): W/"x" matches "x". */
const opaque = (tag: string) => tag.trim().replace(/^W\//, '');

export interface Validators {
	etag: string;
	lastModified: Date;
}

/**
 * True when the response would be 304. If-None-Match wins when present (§13.2.2); otherwise
 * If-Modified-Since compares at whole seconds, the precision of an HTTP date.
 */
export function notModified(ifNoneMatch: string | null, ifModifiedSince: string | null, current: Validators): boolean {
	if (ifNoneMatch !== null) {
		if (ifNoneMatch.trim() === '*') return true;
		const wanted = opaque(current.etag);
		return ifNoneMatch.split(',').some((t) => opaque(t) === wanted);
	}
	if (ifModifiedSince !== null) {
		const since = Date.parse(ifModifiedSince);
		if (Number.isNaN(since)) return false;
		return Math.floor(current.lastModified.getTime() / 1000) <= Math.floor(since / 1000);
	}
	return false;
}
