import { describe, expect, it } from 'vitest';
import { currentGeneration, observedInputs, type LoggedMilestone } from '../../../src/lib/plants/milestones';
import { planSummary } from '../../../src/lib/plants/summary';
import { describeCause, describeShift } from '../../../src/lib/plants/changes';

let id = 0;
const m = (kind: LoggedMilestone['kind'], on: string, extra: Partial<LoggedMilestone> = {}): LoggedMilestone => ({ id: ++id, kind, on, generation: 0, ...extra });

describe('milestones as the engine’s observed inputs', () => {
	it('maps each kind to its input on its own stem, the latest log of a kind winning', () => {
		const { observed, observedFollowers } = observedInputs([
			m('shooting', '2027-01-10'),
			m('shooting', '2027-01-03', { id: 1000 }),
			m('leaves', '2026-06-01', { leaves: 14 }),
			m('followers', '2026-09-01'),
			m('followers', '2026-10-01'),
			m('harvest', '2027-05-01'),
			m('shooting', '2028-02-01', { generation: 2 })
		]);
		expect(observed).toEqual({ shotOn: '2027-01-10', leafCount: { on: '2026-06-01', leaves: 14 }, followersOn: '2026-09-01', harvestedOn: '2027-05-01' });
		expect(observedFollowers).toEqual([{}, { shotOn: '2028-02-01' }]);
	});

	it('the flag leaf, cut-back, stem removal and a loss each reach the engine on their own stem', () => {
		const { observed, observedFollowers } = observedInputs([
			m('flag-leaf', '2027-01-02'),
			m('cut-back', '2027-05-20'),
			m('stem-removed', '2027-07-01'),
			m('lost', '2027-09-01', { generation: 1 })
		]);
		expect(observed).toEqual({ flagLeafOn: '2027-01-02', cutBackOn: '2027-05-20', stemRemovedOn: '2027-07-01' });
		expect(observedFollowers).toEqual([{ lostOn: '2027-09-01' }]);
	});

	it('a leaf count without a number and a division re-time nothing', () => {
		expect(observedInputs([m('leaves', '2026-06-01', { leaves: null }), m('division', '2026-08-01')]).observed).toEqual({});
	});

	it('a harvest or a loss hands the mat on to the next stem', () => {
		expect(currentGeneration([])).toBe(0);
		expect(currentGeneration([m('shooting', '2027-01-01')])).toBe(0);
		expect(currentGeneration([m('harvest', '2027-05-01')])).toBe(1);
		expect(currentGeneration([m('harvest', '2027-05-01'), m('lost', '2028-01-01', { generation: 1 })])).toBe(2);
		// A harvest on follower 1 alone does not skip the mother.
		expect(currentGeneration([m('harvest', '2028-05-01', { generation: 1 })])).toBe(0);
	});
});

describe('the plant row’s summary', () => {
	const steps = [
		{ kind: 'planting', generation: 0, likely: '2026-03-01' },
		{ kind: 'feeding', generation: 0, likely: '2026-04-10' },
		{ kind: 'followers', generation: 0, likely: '2026-08-01' },
		{ kind: 'shooting', generation: 0, likely: '2027-01-10', observed: true },
		{ kind: 'harvest', generation: 0, likely: '2027-05-01' },
		{ kind: 'shooting', generation: 1, likely: '2027-12-01' }
	];

	it('takes the stage of the last step begun and the next step not yet logged', () => {
		const s = planSummary(steps, [m('shooting', '2027-01-10')], '2027-02-01');
		expect(s).toEqual({ stage: 'flowering', nextStepOn: '2027-05-01', nextStepKind: 'harvest', lastMilestoneOn: '2027-01-10', lastMilestoneKind: 'shooting' });
	});

	it('after the harvest it follows the follower', () => {
		const s = planSummary(steps, [m('harvest', '2027-05-01')], '2027-06-01');
		expect(s.nextStepKind).toBe('shooting');
		expect(s.stage).toBe('growing-leaves');
	});

	it('before planting the stage is just planted', () => {
		expect(planSummary(steps, [], '2026-01-01').stage).toBe('planted');
	});
});

describe('what moved, in words', () => {
	it('says which way and how far', () => {
		expect(describeShift(12)).toBe('12 days later');
		expect(describeShift(-1)).toBe('1 day earlier');
		expect(describeCause({ kind: 'milestone-logged', milestoneKind: 'shooting', on: '2027-03-14' })).toBe('the flower was logged on 14 Mar 2027');
	});
});
