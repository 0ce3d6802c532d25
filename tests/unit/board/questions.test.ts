import { describe, expect, it } from 'vitest';
import { HIT_END, HIT_START, snippetPieces } from '../../../src/lib/board/highlight';
import { canSee, plantAgeWeeks, publicAskerName, summaryFrom, waitedFor } from '../../../src/lib/board/questions';

describe('publicAskerName', () => {
	it('shows the first name only', () => {
		expect(publicAskerName('Pim Okonedo')).toBe('Pim');
		expect(publicAskerName('  Sol   Abernathy ')).toBe('Sol');
	});
	it('falls back to initials when the first word is a single letter, and never to the e-mail or surname', () => {
		expect(publicAskerName('J. R. Marrow')).toBe('J.R.M.');
		expect(publicAskerName('')).toBe('A gardener');
	});
});

describe('canSee', () => {
	const q = (over = {}) => ({ askerId: 1, isPublic: false, state: 'waiting' as const, ...over });
	it('a private question: its asker and staff only', () => {
		expect(canSee(q(), { id: 1, role: 'gardener' })).toBe(true);
		expect(canSee(q(), { id: 2, role: 'gardener' })).toBe(false);
		expect(canSee(q(), null)).toBe(false);
		expect(canSee(q(), { id: 9, role: 'staff' })).toBe(true);
	});
	it('a public question: everyone once answered, nobody but staff when hidden', () => {
		expect(canSee(q({ isPublic: true }), null)).toBe(false);
		expect(canSee(q({ isPublic: true, state: 'answered' }), null)).toBe(true);
		expect(canSee(q({ isPublic: true, state: 'resolved' }), { id: 2, role: 'gardener' })).toBe(true);
		expect(canSee(q({ isPublic: true, state: 'hidden' }), { id: 1, role: 'gardener' })).toBe(false);
		expect(canSee(q({ isPublic: true, state: 'hidden' }), { id: 9, role: 'owner' })).toBe(true);
	});
});

describe('waitedFor and plantAgeWeeks', () => {
	const now = new Date('2026-12-01T12:00:00Z');
	it('says how long in the largest sensible unit', () => {
		expect(waitedFor(new Date('2026-12-01T11:59:00Z'), now)).toBe('1 minute');
		expect(waitedFor(new Date('2026-12-01T09:00:00Z'), now)).toBe('3 hours');
		expect(waitedFor(new Date('2026-11-28T12:00:00Z'), now)).toBe('3 days');
		expect(waitedFor(new Date('2026-12-02T00:00:00Z'), now)).toBe('0 minutes');
	});
	it('adds whole weeks since planting to the age at planting', () => {
		expect(plantAgeWeeks('2026-11-01', 12, '2026-11-15')).toBe(14);
		expect(plantAgeWeeks('2026-11-01', 12, '2026-11-14')).toBe(13);
		expect(plantAgeWeeks(null, 12, '2026-11-14')).toBeNull();
	});
});

describe('summaryFrom', () => {
	it('takes the first sentence', () => {
		expect(summaryFrom('Leaves turn yellow. Then brown.')).toBe('Leaves turn yellow.');
		expect(summaryFrom('No full stop here')).toBe('No full stop here.');
	});
	it('cuts a long sentence at a word, within the limit', () => {
		const s = summaryFrom('word '.repeat(100));
		expect(s.length).toBeLessThanOrEqual(240);
		expect(s.endsWith('…')).toBe(true);
	});
});

describe('snippetPieces', () => {
	it('splits a headline into plain text and hits, dropping stray control characters', () => {
		expect(snippetPieces(`Cut the ${HIT_START}bunch${HIT_END} when \u0001ready`)).toEqual([
			{ text: 'Cut the ', hit: false },
			{ text: 'bunch', hit: true },
			{ text: ' when ready', hit: false }
		]);
	});
	it('keeps markup as text', () => {
		expect(snippetPieces(`<b>${HIT_START}x${HIT_END}</b>`)).toEqual([
			{ text: '<b>', hit: false },
			{ text: 'x', hit: true },
			{ text: '</b>', hit: false }
		]);
	});
});
