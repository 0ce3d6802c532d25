import { describe, expect, it } from 'vitest';
import { isForbiddenCrossSiteForm } from '../../../src/lib/server/csrf';

const url = (p: string) => new URL(`http://127.0.0.1:4173${p}`);
const req = (method: string, type: string | null, origin: string | null) =>
	new Request('http://127.0.0.1:4173/', {
		method,
		headers: { ...(type ? { 'content-type': type } : {}), ...(origin ? { origin } : {}) },
		body: method === 'GET' ? undefined : 'x'
	});

describe('cross-site form check (OWASP CSRF Prevention Cheat Sheet: verify the Origin header)', () => {
	it('refuses a form post from another origin or with no origin', () => {
		expect(isForbiddenCrossSiteForm(req('POST', 'application/x-www-form-urlencoded', 'http://evil.example'), url('/login'))).toBe(true);
		expect(isForbiddenCrossSiteForm(req('POST', 'multipart/form-data; boundary=x', null), url('/nursery/team'))).toBe(true);
		expect(isForbiddenCrossSiteForm(req('POST', 'text/plain;charset=UTF-8', 'http://evil.example'), url('/login'))).toBe(true);
	});
	it('lets same-origin forms, JSON and reads through', () => {
		expect(isForbiddenCrossSiteForm(req('POST', 'application/x-www-form-urlencoded', 'http://127.0.0.1:4173'), url('/login'))).toBe(false);
		expect(isForbiddenCrossSiteForm(req('POST', 'application/json', 'http://evil.example'), url('/login'))).toBe(false);
		expect(isForbiddenCrossSiteForm(req('GET', null, 'http://evil.example'), url('/login'))).toBe(false);
	});
	it('leaves the cookie-less public API to answer bad bodies with its own 400', () => {
		expect(isForbiddenCrossSiteForm(req('POST', 'application/x-www-form-urlencoded', null), url('/api/v1/plan-preview'))).toBe(false);
	});
	it('refuses a cross-site form post to an API route that reads the session cookie', () => {
		for (const path of ['/api/v1/sales', '/api/v1/stock', '/api/v1/sales/1', '/api/v1/plan-preview/x']) {
			expect(isForbiddenCrossSiteForm(req('POST', 'application/x-www-form-urlencoded', 'http://evil.example'), url(path)), path).toBe(true);
		}
		expect(isForbiddenCrossSiteForm(req('DELETE', 'text/plain', 'http://evil.example'), url('/api/v1/sales/1'))).toBe(true);
	});
	it('lets a mail provider\'s one-click unsubscribe (RFC 8058) through: no Origin, no cookies, only the token in the path', () => {
		expect(isForbiddenCrossSiteForm(req('POST', 'application/x-www-form-urlencoded', null), url('/unsubscribe/abc'))).toBe(false);
		expect(isForbiddenCrossSiteForm(req('POST', 'application/x-www-form-urlencoded', 'http://evil.example'), url('/settings'))).toBe(true);
		expect(isForbiddenCrossSiteForm(req('POST', 'application/x-www-form-urlencoded', 'http://evil.example'), url('/api/v1/feeds'))).toBe(true);
	});
});
