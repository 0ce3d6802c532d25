/**
 * One limit for every /api/ route, and one for the form submissions of signed-out visitors, per
 * client address: token buckets that refill evenly over a minute. It guards this instance's CPU (a calendar costs tens of milliseconds to write the first
 * time), so each instance counts in its own memory: behind a load balancer with n instances an
 * address gets up to n times the budget, which is what n instances can serve. Limits that protect
 * accounts (sign-in, mail, sign-up) are different: they are counted in PostgreSQL, shared by all.
 */
import { LRUCache } from 'lru-cache';
import { json, text, type RequestEvent } from '@sveltejs/kit';
import { apiError } from './api';
import { config } from './config';

interface Bucket {
	tokens: number;
	at: number;
}

/** The least recently seen addresses are forgotten first, so memory stays bounded under a spray of addresses. */
const TRACKED_ADDRESSES = 50_000;

export function tokenBucketLimiter(perMinute: number, capacity = perMinute, max = TRACKED_ADDRESSES) {
	const buckets = new LRUCache<string, Bucket>({ max });
	const perMs = perMinute / 60_000;
	return {
		/** Takes one token; answers how many seconds to wait when there is none. */
		take(address: string, now = Date.now()): { allowed: true } | { allowed: false; retryAfterS: number } {
			const b = buckets.get(address) ?? { tokens: capacity, at: now };
			const tokens = Math.min(capacity, b.tokens + (now - b.at) * perMs);
			if (tokens < 1) {
				buckets.set(address, { tokens, at: now });
				return { allowed: false, retryAfterS: Math.ceil((1 - tokens) / perMs / 1000) };
			}
			buckets.set(address, { tokens: tokens - 1, at: now });
			return { allowed: true };
		}
	};
}

const apiLimiter = tokenBucketLimiter(config.apiRequestsPerMinute);

/** A 429 in the API's error shape when the address is over its budget; null otherwise. */
export function publicApiLimit(event: Pick<RequestEvent, 'url' | 'getClientAddress'>): Response | null {
	if (!event.url.pathname.startsWith('/api/')) return null;
	const verdict = apiLimiter.take(event.getClientAddress());
	if (verdict.allowed) return null;
	const response = apiError('Too many requests from this address', [{ path: [], message: `Wait ${verdict.retryAfterS} s and try again` }], 429);
	response.headers.set('retry-after', String(verdict.retryAfterS));
	return response;
}

export type Limiter = ReturnType<typeof tokenBucketLimiter>;

/**
 * Signed-out form submissions (sign-in, sign-up, reset, claim, waitlist) each cost database work
 * before they can be refused; a flood of them from one address queued every other visitor's
 * sign-in behind it on the connection pool (bench/routes.mjs). Over the budget, a plain 429 that
 * costs nothing. Signed-in people are not counted here: their actions carry their own limits.
 */
export function formPostLimiter(limiter: Limiter) {
	return (event: Pick<RequestEvent, 'url' | 'request' | 'getClientAddress'>, signedIn: boolean): Response | null => {
		if (signedIn || event.request.method !== 'POST' || event.url.pathname.startsWith('/api/')) return null;
		const verdict = limiter.take(event.getClientAddress());
		if (verdict.allowed) return null;
		const message = `Too many form submissions from this address: wait ${verdict.retryAfterS} s and try again.`;
		const init = { status: 429, headers: { 'retry-after': String(verdict.retryAfterS) } };
		// A form enhanced by SvelteKit posts with this header and reads the answer as an action result:
		// as an error result the page shows the message (plain text would break the page's script).
		if (event.request.headers.get('x-sveltekit-action') === 'true') return json({ type: 'error', status: 429, error: { message } }, init);
		return text(message, init);
	};
}

export const publicFormLimit = formPostLimiter(tokenBucketLimiter(config.formPostsPerMinute));
