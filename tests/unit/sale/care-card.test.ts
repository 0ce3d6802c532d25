import { describe, expect, it } from 'vitest';
import { computePlan, findClimate, findCultivar, parseIsoDate } from '../../../src/lib/care';
import { cardLayout, firstWeeks, weekText } from '../../../src/lib/care-card';

const plan = computePlan({
	cultivar: findCultivar('grand-nain')!,
	plantedOn: '2026-04-04',
	ageAtPlantingWeeks: 12,
	climate: { monthlyMeanC: findClimate('south-florida-coast')!.monthlyMeanC }
});

describe('the care card’s first weeks', () => {
	const steps = firstWeeks(plan, '2026-04-04');
	it('starts with planting in the planting week and includes the first feeding with its week', () => {
		expect(steps[0]).toMatchObject({ kind: 'planting', week: 0 });
		const feeding = plan.steps.find((s) => s.kind === 'feeding')!;
		const shown = steps.find((s) => s.kind === 'feeding')!;
		expect(shown.likely).toBe(feeding.likely);
		expect(shown.week).toBe(Math.floor((parseIsoDate(feeding.likely) - parseIsoDate('2026-04-04')) / 7));
	});
	it('keeps to the first twelve weeks and at most four steps', () => {
		expect(steps.length).toBeLessThanOrEqual(4);
		for (const s of steps) expect(s.week).toBeLessThanOrEqual(12);
	});
	it('words the week and picks a known layout', () => {
		expect(weekText(0)).toBe('in the planting week');
		expect(weekText(5)).toBe('about 5 weeks after planting');
		expect(cardLayout('sheet')).toBe('sheet');
		expect(cardLayout('poster')).toBe('a6');
	});
});
