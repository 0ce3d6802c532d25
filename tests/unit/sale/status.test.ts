import { describe, expect, it } from 'vitest';
import { statusFromStored } from '../../../src/lib/server/plants/service';

const step = (kind: string, likely: string, generation = 0, observed = false) => ({ plantId: 1, kind, title: `${kind} title`, generation, likely, observed });

const steps = [
	step('planting', '2026-03-01'),
	step('feeding', '2026-04-01'),
	step('followers', '2026-07-01'),
	step('flag-leaf', '2026-11-01'),
	step('harvest', '2027-03-15'),
	step('cut-back', '2027-03-20'),
	step('flag-leaf', '2027-09-01', 1)
];

describe('a plant’s stage and next step, from its stored plan', () => {
	it('has no stage before planting, with planting as the next step', () => {
		expect(statusFromStored('2026-03-01', steps, [], '2026-02-20')).toMatchObject({ stage: null, nextStep: { kind: 'planting', on: '2026-03-01', title: 'planting title' } });
	});
	it('follows the last stage reached and the first step still ahead', () => {
		expect(statusFromStored('2026-03-01', steps, [], '2026-03-05')).toMatchObject({ stage: { id: 'planted' }, nextStep: { kind: 'feeding' } });
		expect(statusFromStored('2026-03-01', steps, [], '2026-08-01')).toMatchObject({ stage: { id: 'followers-out' }, nextStep: { kind: 'flag-leaf', generation: 0 } });
	});
	it('a logged harvest hands the mat to the follower, whose steps come next', () => {
		const logged = [{ plantId: 1, id: 1, kind: 'harvest' as const, generation: 0, on: '2027-03-10', leaves: null, photoId: null }];
		const withHarvest = steps.map((s) => (s.kind === 'harvest' ? { ...s, likely: '2027-03-10', observed: true } : s));
		expect(statusFromStored('2026-03-01', withHarvest, logged, '2027-04-01').nextStep).toMatchObject({ kind: 'flag-leaf', generation: 1 });
	});
	it('an unclaimed plant (no planting day, no stored plan) has neither', () => {
		expect(statusFromStored(null, [], [], '2026-01-01')).toEqual({ stage: null, nextStep: null });
	});
});
