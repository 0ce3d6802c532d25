import { describe, expect, it } from 'vitest';
import { computePlan } from '../../../src/lib/care/plan';
import { days, input, only } from './helpers';

describe('re-timing from logged milestones', () => {
	it('a logged shooting date moves the harvest to shooting + f(climate), whatever the planting date or age', () => {
		const shotOn = '2026-05-20';
		const spans = [
			{ plantedOn: '2025-01-10', ageAtPlantingWeeks: 0 },
			{ plantedOn: '2025-06-01', ageAtPlantingWeeks: 30 },
			{ plantedOn: '2024-09-01', ageAtPlantingWeeks: 104 }
		].map((o) => {
			const p = computePlan(input({ ...o, observed: { shotOn } }));
			const h = only(p, 'harvest');
			return [h.earliest, h.likely, h.latest];
		});
		expect(spans[1]).toEqual(spans[0]);
		expect(spans[2]).toEqual(spans[0]);
		const cooler = computePlan(input({ climateSlug: 'canary-islands-coast', plantedOn: '2025-01-10', observed: { shotOn } }));
		expect(only(cooler, 'harvest').likely > spans[0][1]).toBe(true);
	});
	it('observed steps are marked and pinned to the logged date', () => {
		const p = computePlan(input({ observed: { shotOn: '2026-04-01', followersOn: '2025-08-20' } }));
		for (const [kind, on] of [['shooting', '2026-04-01'], ['followers', '2025-08-20']] as const) {
			const s = only(p, kind);
			expect(s.observed).toBe(true);
			expect([s.earliest, s.likely, s.latest]).toEqual([on, on, on]);
		}
		expect(only(p, 'harvest').observed).toBeUndefined();
	});
	it('windows downstream of an observation are narrower', () => {
		const forecast = computePlan(input());
		const shotOn = only(forecast, 'shooting').likely;
		const logged = computePlan(input({ observed: { shotOn } }));
		const width = (p: typeof forecast) => days(only(p, 'harvest').earliest, only(p, 'harvest').latest);
		expect(width(logged)).toBeLessThan(width(forecast));
	});
	it('the day followers appeared re-times the next generation from it', () => {
		const early = computePlan(input({ observed: { followersOn: '2025-07-01' } }));
		const late = computePlan(input({ observed: { followersOn: '2025-10-01' } }));
		expect(only(late, 'shooting', 1).likely > only(early, 'shooting', 1).likely).toBe(true);
		expect(only(early, 'shooting', 0).likely).toBe(only(late, 'shooting', 0).likely);
	});
	it('a leaf count re-estimates shooting from the leaves still to come', () => {
		const base = computePlan(input());
		const ahead = computePlan(input({ observed: { leafCount: { on: '2025-09-01', leaves: 50 } } }));
		const behind = computePlan(input({ observed: { leafCount: { on: '2025-09-01', leaves: 20 } } }));
		expect(only(ahead, 'shooting').likely < only(base, 'shooting').likely).toBe(true);
		expect(only(behind, 'shooting').likely > only(base, 'shooting').likely).toBe(true);
		// 5 leaves to go at about 73 °C·d per leaf in a Florida autumn: a few weeks, not months
		expect(days('2025-09-01', only(ahead, 'shooting').likely)).toBeLessThan(60);
	});
	it('a logged harvest pins cut-back to that day and stem removal 14 days later', () => {
		const p = computePlan(input({ observed: { shotOn: '2026-03-01', harvestedOn: '2026-06-25' } }));
		expect(only(p, 'harvest').observed).toBe(true);
		expect(only(p, 'cut-back').likely).toBe('2026-06-25');
		expect(only(p, 'stem-removal').likely).toBe('2026-07-09');
	});
	it('rejects milestones logged before planting', () => {
		expect(() => computePlan(input({ observed: { shotOn: '2024-01-01' } }))).toThrow(RangeError);
	});
});
