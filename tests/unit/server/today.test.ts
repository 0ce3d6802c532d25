import { describe, expect, it } from 'vitest';
import { todayIso } from '$lib/server/plan-preview';

describe("the planner's today", () => {
	it('follows the nursery time zone, not the server clock (IANA tz database)', () => {
		const instant = new Date('2026-12-01T20:30:00Z');
		expect(todayIso(instant, 'UTC')).toBe('2026-12-01');
		expect(todayIso(instant, 'Australia/Sydney')).toBe('2026-12-02');
		expect(todayIso(instant, 'America/Los_Angeles')).toBe('2026-12-01');
	});
});
