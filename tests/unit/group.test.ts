import { describe, expect, it } from 'vitest';
import { groupBy } from '../../src/lib/group';

describe('groupBy', () => {
	it('keeps every item once, in order within its group, keyed as given', () => {
		const rows = [
			{ plant: 2, n: 'a' },
			{ plant: 1, n: 'b' },
			{ plant: 2, n: 'c' }
		];
		const g = groupBy(rows, (r) => r.plant);
		expect([...g.keys()]).toEqual([2, 1]);
		expect(g.get(2)!.map((r) => r.n)).toEqual(['a', 'c']);
		expect(g.get(1)!.map((r) => r.n)).toEqual(['b']);
		expect(g.get(3)).toBeUndefined();
	});
});
