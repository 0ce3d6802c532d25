/** The forecast algebra on its own, on a clock where every day brings one degree-day. */
import { describe, expect, it } from 'vitest';
import { after, factOn, from, likelyTt, noLaterThan, observedOn, windowOf, type Clock } from '../../../src/lib/care/forecast';

/** One degree-day a day, so distances read as days: day d has accumulated d degree-days by its start. */
const linear: Clock = {
	cumulativeAt: (day) => day,
	dayReaching: (target, notBefore) => Math.max(notBefore, Math.ceil(target) - 1)
};

describe('forecast algebra', () => {
	const planting = factOn(linear, 100);
	it('a route forward from a fact: likely at the distance, window ± the share of it', () => {
		const w = windowOf(linear, from(planting, 50), 0.1, 100);
		expect(w).toEqual({ earliest: 144, likely: 149, latest: 154, observed: false });
	});
	it('after() adds distance and keeps the anchor, so the window keeps growing from the same fact', () => {
		const w = windowOf(linear, after(from(planting, 50), 50), 0.1, 100);
		expect(w).toEqual({ earliest: 189, likely: 199, latest: 209, observed: false });
	});
	it('a logged moment is pinned and narrows what follows', () => {
		const logged = observedOn(linear, 180);
		expect(windowOf(linear, logged, 0.1, 100)).toEqual({ earliest: 180, likely: 180, latest: 180, observed: true });
		const next = windowOf(linear, after(logged, 20), 0.1, 100);
		expect(next.latest - next.earliest).toBe(4);
	});
	it('a negative distance reaches back from a fact and never before the floor', () => {
		expect(windowOf(linear, after(observedOn(linear, 180), -30), 0.1, 100)).toEqual({ earliest: 146, likely: 149, latest: 152, observed: false });
		expect(windowOf(linear, after(observedOn(linear, 120), -50), 0.1, 100).earliest).toBe(100);
	});
	it('noLaterThan takes the earlier of two moments, but never moves a logged one', () => {
		const late = from(planting, 90);
		const limit = observedOn(linear, 150);
		expect(likelyTt(noLaterThan(late, limit))).toBe(150);
		expect(noLaterThan(limit, from(planting, 10))).toBe(limit);
	});
});
