import { describe, expect, it } from 'vitest';
import { safeNext } from '../../../src/lib/nav';

// OWASP Unvalidated Redirects and Forwards Cheat Sheet: follow only same-site destinations.
describe('safeNext', () => {
	it('keeps same-site paths with their query and fragment', () => {
		expect(safeNext('/plants', '/')).toBe('/plants');
		expect(safeNext('/nursery/team?page=2#people', '/')).toBe('/nursery/team?page=2#people');
		// An encoded newline is just part of a path: harmless, and valid in a header.
		expect(safeNext('/%0A', '/')).toBe('/%0A');
	});

	const offSite = ['//evil.example/x', '/\\evil.example', '/\t/evil.example', '/\n/evil.example', '/\r\n/evil.example', 'https://evil.example/', 'javascript:alert(1)', 'evil.example', ''];
	for (const next of offSite) {
		it(`refuses ${JSON.stringify(next)}`, () => {
			expect(safeNext(next, '/home')).toBe('/home');
		});
	}

	it('what it returns can always go in a Location header', () => {
		for (const next of [...offSite, '/\u0000', '/\u007f']) expect(() => new Headers({ location: safeNext(next, '/home') })).not.toThrow();
	});
});
