import { describe, expect, it } from 'vitest';
import { combineGuides, compareTexts, slugify, type ListedGuide } from '../../../src/lib/board/guides';
import { SLUG_PATTERN } from '../../../src/lib/schema/guides';

describe('slugify', () => {
	it('makes a web address from a title', () => {
		expect(slugify('Feeding in a cold winter!')).toBe('feeding-in-a-cold-winter');
		expect(slugify('  Crème brûlée  bananas ')).toBe('creme-brulee-bananas');
	});
	it('always gives a valid slug, even from punctuation alone', () => {
		for (const t of ['!!!', 'a', '—', 'x'.repeat(300) + ' y', 'Ünïcödé — ☃ 2026']) {
			const s = slugify(t);
			expect(s, t).toMatch(SLUG_PATTERN);
			expect(s.length, t).toBeGreaterThanOrEqual(2);
			expect(s.length, t).toBeLessThanOrEqual(80);
		}
	});
});

const built = (slug: string, order: number, stage: string): ListedGuide => ({ slug, title: slug, summary: '', stages: [stage], groups: [], origin: 'built-in', order });
const own = (slug: string, order: number, extra: Partial<ListedGuide & { replaces: string | null }> = {}) => ({
	slug,
	title: slug,
	summary: '',
	stages: [] as string[],
	groups: [] as string[],
	origin: 'nursery' as const,
	order,
	replaces: null as string | null,
	...extra
});

describe('combineGuides', () => {
	const builtIn = [built('planting', 1, 'planted'), built('feeding', 2, 'growing-leaves'), built('harvest', 3, 'ready')];
	it('puts a replacing guide where the built-in one stood, keeping its stage when it has none', () => {
		const list = combineGuides(builtIn, [own('our-feeding', 10_000, { replaces: 'feeding' })], {});
		expect(list.map((g) => g.slug)).toEqual(['planting', 'our-feeding', 'harvest']);
		expect(list[1].stages).toEqual(['growing-leaves']);
	});
	it('lists guides of their own after the built-in ones', () => {
		expect(combineGuides(builtIn, [own('mulch', 10_000)], {}).map((g) => g.slug)).toEqual(['planting', 'feeding', 'harvest', 'mulch']);
	});
	it('filters by stage and by cultivar group; a guide without groups fits every group', () => {
		const nursery = [own('plantain-care', 10_000, { stages: ['ready'], groups: ['AAB'] }), own('cavendish', 10_001, { stages: ['ready'], groups: ['AAA'] })];
		expect(combineGuides(builtIn, nursery, { stage: 'ready' }).map((g) => g.slug)).toEqual(['harvest', 'plantain-care', 'cavendish']);
		expect(combineGuides(builtIn, nursery, { stage: 'ready', group: 'AAB' }).map((g) => g.slug)).toEqual(['harvest', 'plantain-care']);
		expect(combineGuides(builtIn, nursery, { group: 'ABB' }).map((g) => g.slug)).toEqual(['planting', 'feeding', 'harvest']);
	});
	it('a guide replacing a built-in one that no longer exists still appears', () => {
		expect(combineGuides(builtIn, [own('old', 10_000, { replaces: 'gone' })], {}).map((g) => g.slug)).toContain('old');
	});
});

describe('compareTexts', () => {
	it('marks lines added, removed and kept', () => {
		expect(compareTexts('a\nb\nc\n', 'a\nB\nc\nd\n')).toEqual([
			{ change: 'same', text: 'a' },
			{ change: 'removed', text: 'b' },
			{ change: 'added', text: 'B' },
			{ change: 'same', text: 'c' },
			{ change: 'added', text: 'd' }
		]);
	});
	it('from nothing, every line is added', () => {
		expect(compareTexts('', 'one\ntwo').map((l) => l.change)).toEqual(['added', 'added']);
	});
});
