/** One set of stage words and one name per stem, and the stage a stem is in on a day. */
import { describe, expect, it } from 'vitest';
import { computePlan } from '../../../src/lib/care/plan';
import { PLANT_STAGES, generationLabel, generationName, stageOn } from '../../../src/lib/care/stages';
import { formatIsoDate, parseIsoDate } from '../../../src/lib/care/dates';
import { input, only } from './helpers';

const plan = computePlan(input());
const dayBefore = (iso: string) => formatIsoDate(parseIsoDate(iso) - 1);

describe('plant stages', () => {
	it('walks generation 0 through its stages in life order on the plan’s own dates', () => {
		const firstFeeding = plan.steps.find((s) => s.kind === 'feeding')!.likely;
		expect(stageOn(plan, '2025-03-14')).toBeNull();
		expect(stageOn(plan, '2025-03-15')).toBe('planted');
		expect(stageOn(plan, dayBefore(firstFeeding))).toBe('planted');
		expect(stageOn(plan, firstFeeding)).toBe('growing-leaves');
		expect(stageOn(plan, only(plan, 'followers').likely)).toBe('followers-out');
		expect(stageOn(plan, dayBefore(only(plan, 'flag-leaf').likely))).toBe('followers-out');
		expect(stageOn(plan, only(plan, 'flag-leaf').likely)).toBe('flowering');
		expect(stageOn(plan, only(plan, 'harvest').earliest)).toBe('ready');
		expect(stageOn(plan, only(plan, 'cut-back').likely)).toBe('cut-back');
		expect(stageOn(plan, only(plan, 'stem-removal').likely)).toBe('handed-on');
	});
	it('a follower starts growing leaves the day its mother’s followers show', () => {
		const born = only(plan, 'followers', 0).likely;
		expect(stageOn(plan, dayBefore(born), 1)).toBeNull();
		expect(stageOn(plan, born, 1)).toBe('growing-leaves');
	});
	it('a logged loss puts the stem in the lost stage from that day', () => {
		const lost = computePlan(input({ observed: { lostOn: '2025-12-01' } }));
		expect(stageOn(lost, '2025-11-30')).not.toBe('lost');
		expect(stageOn(lost, '2025-12-01')).toBe('lost');
	});
	it('every stage has a distinct id and label and a one-sentence explanation', () => {
		expect(new Set(PLANT_STAGES.map((s) => s.id)).size).toBe(PLANT_STAGES.length);
		expect(new Set(PLANT_STAGES.map((s) => s.label)).size).toBe(PLANT_STAGES.length);
		for (const s of PLANT_STAGES) expect(s.explanation).toMatch(/^[A-Z].*\.$/);
	});
	it('names each stem one way: your plant, follower 1, follower 2', () => {
		expect([0, 1, 2].map(generationLabel)).toEqual(['Your plant', 'Follower 1', 'Follower 2']);
		expect(generationName(1)).toBe('follower 1');
		const titles = plan.steps.map((s) => s.title).join(' ');
		expect(titles).not.toMatch(/first follower|plant you bought|plant as sold|\bstem \d/i);
		expect(only(plan, 'shooting', 2).title).toBe('Follower 2 flowers (shooting)');
		expect(only(plan, 'followers', 1).title).toBe('Followers appear at the base of follower 1');
	});
});
