import { describe, expect, it } from 'vitest';
import { computePlan } from '../../../src/lib/care/plan';
import { formatIsoDate, parseIsoDate } from '../../../src/lib/care/dates';
import { PlanInputError } from '../../../src/lib/care/validate';
import { HELD_BACK_RATE } from '../../../src/lib/care/model';
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
	it('a shooting logged months late moves the flag leaf to just before it, and the follower’s flowering after it', () => {
		const forecast = computePlan(input());
		const late = formatIsoDate(parseIsoDate(only(forecast, 'shooting').likely) + 120);
		const p = computePlan(input({ observed: { shotOn: late } }));
		const gap = days(only(p, 'flag-leaf').likely, late);
		expect(gap).toBeGreaterThan(0);
		expect(gap).toBeLessThanOrEqual(14);
		// The follower is held back until its mother is cut, so her late bunch delays its flower too:
		// by the share of those 120 days it would have grown at the full rate (1 − HELD_BACK_RATE),
		// less a few days because the late months are warmer than the ones it replaces.
		const delay = days(only(forecast, 'shooting', 1).likely, only(p, 'shooting', 1).likely);
		expect(delay).toBeGreaterThan(120 * (1 - HELD_BACK_RATE) - 10);
		expect(delay).toBeLessThan(120);
		expect(only(p, 'shooting', 1).likely > only(p, 'harvest', 0).likely).toBe(true);
	});
	it('a logged flag leaf re-times the flower one leaf interval later, and the harvest from it', () => {
		const flagLeafOn = '2026-06-01';
		const p = computePlan(input({ observed: { flagLeafOn } }));
		expect(only(p, 'flag-leaf').observed).toBe(true);
		const gap = days(flagLeafOn, only(p, 'shooting').likely);
		expect(gap).toBeGreaterThan(0);
		expect(gap).toBeLessThanOrEqual(14);
		expect(only(p, 'harvest').likely > only(p, 'shooting').likely).toBe(true);
	});
	it('a logged cut-back pins stem removal 14 days later; a logged stem removal is pinned', () => {
		const p = computePlan(input({ observed: { shotOn: '2026-03-01', harvestedOn: '2026-06-25', cutBackOn: '2026-06-28' } }));
		expect(only(p, 'cut-back')).toMatchObject({ likely: '2026-06-28', observed: true });
		expect(only(p, 'stem-removal').likely).toBe('2026-07-12');
		const q = computePlan(input({ observed: { shotOn: '2026-03-01', harvestedOn: '2026-06-25', stemRemovedOn: '2026-07-30' } }));
		expect(only(q, 'stem-removal')).toMatchObject({ likely: '2026-07-30', observed: true });
	});
	it('a cut-back logged before the forecast harvest brings the harvest to it', () => {
		const p = computePlan(input({ observed: { shotOn: '2026-03-01', cutBackOn: '2026-05-20' } }));
		expect(only(p, 'harvest').likely <= '2026-05-20').toBe(true);
	});
	it('a lost stem drops its later steps; its follower takes over from the day of the loss', () => {
		const base = computePlan(input());
		const lostOn = formatIsoDate(parseIsoDate(only(base, 'shooting').likely) - 10);
		const p = computePlan(input({ observed: { lostOn } }));
		expect(p.lost).toEqual([{ generation: 0, on: lostOn }]);
		expect(p.steps.filter((s) => s.generation === 0 && s.kind !== 'planting' && s.kind !== 'feeding').every((s) => s.likely <= lostOn)).toBe(true);
		expect(p.steps.some((s) => s.kind === 'harvest' && s.generation === 0)).toBe(false);
		expect(only(p, 'shooting', 1).likely < only(base, 'shooting', 1).likely).toBe(true);
	});
	it('a stem lost before its followers showed ends the mat', () => {
		const p = computePlan(input({ observed: { lostOn: '2025-04-01' } }));
		expect(p.steps.some((s) => s.generation > 0)).toBe(false);
		expect(p.steps.filter((s) => s.kind === 'feeding').every((s) => s.likely <= '2025-04-01')).toBe(true);
	});
	it('each follower’s own log re-times it and what comes after it', () => {
		const base = computePlan(input());
		const shotOn = formatIsoDate(parseIsoDate(only(base, 'shooting', 1).likely) + 90);
		const p = computePlan(input({ observedFollowers: [{ shotOn }] }));
		expect(only(p, 'shooting', 1)).toMatchObject({ likely: shotOn, observed: true });
		expect(only(p, 'harvest', 1).likely > only(base, 'harvest', 1).likely).toBe(true);
		expect(only(p, 'shooting', 2).likely > only(base, 'shooting', 2).likely).toBe(true);
		expect(only(p, 'shooting', 0).likely).toBe(only(base, 'shooting', 0).likely);
	});
	it('a log for a later follower extends the plan to it', () => {
		const p = computePlan(input({ observedFollowers: [{}, {}, { followersOn: '2030-01-01' }] }));
		expect(Math.max(...p.steps.map((s) => s.generation))).toBe(3);
	});
	it('refuses, naming the field, milestones out of life order', () => {
		const refusal = (o: Parameters<typeof input>[0]) => {
			try {
				computePlan(input(o));
			} catch (e) {
				return e instanceof PlanInputError ? e.issues : e;
			}
			return [];
		};
		expect(refusal({ observed: { shotOn: '2026-05-01', flagLeafOn: '2026-06-01' } })).toEqual([
			{ path: ['observed', 'shotOn'], message: 'Shooting cannot come before the flag leaf' }
		]);
		expect(refusal({ observedFollowers: [{ harvestedOn: '2027-01-01', cutBackOn: '2026-12-01' }] })).toEqual([
			{ path: ['observedFollowers', 0, 'cutBackOn'], message: 'Cut-back cannot come before harvest' }
		]);
		expect(refusal({ observed: { leafCount: { on: '2025-06-01', leaves: 2.5 } } })).toEqual([
			{ path: ['observed', 'leafCount', 'leaves'], message: 'Enter a whole number of leaves from 0 to 80' }
		]);
	});
});
