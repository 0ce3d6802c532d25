/**
 * Reminder timing and reconciliation. Offsets are checked against the IANA time zone database's
 * published rules (tz database, 2024 and later releases): New York UTC−5 / UTC−4 with the change on
 * the second Sunday of March at 02:00, Kolkata UTC+5:30 all year, Auckland UTC+13 in January.
 */
import { describe, expect, it } from 'vitest';
import { localDate, mondayOnOrBefore, reconcileReminders, wantedReminders, zonedInstant, type ExistingReminder, type Preferences } from '$lib/reminders/schedule';

const at = (iso: string) => new Date(iso);

describe('zonedInstant: a local date and hour as an instant', () => {
	it('New York: 08:00 is 13:00 UTC in winter and 12:00 UTC in summer', () => {
		expect(zonedInstant('2026-01-15', 8, 'America/New_York').toISOString()).toBe('2026-01-15T13:00:00.000Z');
		expect(zonedInstant('2026-07-15', 8, 'America/New_York').toISOString()).toBe('2026-07-15T12:00:00.000Z');
	});
	it('the skipped hour on 8 Mar 2026 in New York (02:00 does not exist) lands on 03:00 EDT = 07:00 UTC', () => {
		expect(zonedInstant('2026-03-08', 2, 'America/New_York').toISOString()).toBe('2026-03-08T07:00:00.000Z');
	});
	it('the repeated hour on 1 Nov 2026 in New York (01:00 happens twice) is its first occurrence, 05:00 UTC', () => {
		expect(zonedInstant('2026-11-01', 1, 'America/New_York').toISOString()).toBe('2026-11-01T05:00:00.000Z');
	});
	it('half-hour and east-of-UTC zones: Kolkata 09:00 = 03:30 UTC; Auckland 07:00 on 10 Jan = 18:00 UTC the day before', () => {
		expect(zonedInstant('2026-05-01', 9, 'Asia/Kolkata').toISOString()).toBe('2026-05-01T03:30:00.000Z');
		expect(zonedInstant('2026-01-10', 7, 'Pacific/Auckland').toISOString()).toBe('2026-01-09T18:00:00.000Z');
	});
	it('localDate reads the calendar date in the zone', () => {
		expect(localDate(at('2026-01-09T18:00:00Z'), 'Pacific/Auckland')).toBe('2026-01-10');
		expect(localDate(at('2026-01-10T03:00:00Z'), 'America/New_York')).toBe('2026-01-09');
	});
});

describe('mondayOnOrBefore (ISO 8601 weeks)', () => {
	it('Sunday 15 Mar 2026 → Monday 9 Mar; a Monday is its own', () => {
		expect(mondayOnOrBefore('2026-03-15')).toBe('2026-03-09');
		expect(mondayOnOrBefore('2026-03-09')).toBe('2026-03-09');
		expect(mondayOnOrBefore('2026-03-01')).toBe('2026-02-23');
	});
});

const steps = [
	{ id: 1, title: 'Plant', earliest: '2026-03-01', latest: '2026-03-01' },
	{ id: 2, title: 'Feed', earliest: '2026-03-12', latest: '2026-03-14' },
	{ id: 3, title: 'Shooting', earliest: '2026-06-03', latest: '2026-07-20' }
];
const each: Preferences = { mode: 'each-step', hour: 8, timeZone: 'UTC' };

describe('wantedReminders', () => {
	it('each step: the morning its window opens; a closed window gets none; an open one the next send hour', () => {
		const wanted = wantedReminders(steps, each, at('2026-03-13T09:00:00Z'));
		expect(wanted.map((w) => [w.stepId, w.channel, w.dueAt.toISOString()])).toEqual([
			[2, 'email-step', '2026-03-14T08:00:00.000Z'],
			[3, 'email-step', '2026-06-03T08:00:00.000Z']
		]);
	});
	it('weekly digest: the Monday on or before the window opens, in the gardener\'s zone', () => {
		const wanted = wantedReminders(steps, { mode: 'weekly-digest', hour: 7, timeZone: 'America/New_York' }, at('2026-02-01T00:00:00Z'));
		expect(wanted.map((w) => [w.stepId, w.channel, w.dueAt.toISOString()])).toEqual([
			[1, 'email-digest', '2026-02-23T12:00:00.000Z'],
			[2, 'email-digest', '2026-03-09T11:00:00.000Z'],
			[3, 'email-digest', '2026-06-01T11:00:00.000Z']
		]);
	});
	it('a digest step whose Monday has passed but whose window is open goes in the next Monday\'s digest', () => {
		const wanted = wantedReminders(steps, { mode: 'weekly-digest', hour: 7, timeZone: 'UTC' }, at('2026-06-10T12:00:00Z'));
		expect(wanted.map((w) => w.dueAt.toISOString())).toEqual(['2026-06-15T07:00:00.000Z']);
	});
	it('off wants nothing', () => expect(wantedReminders(steps, { ...each, mode: 'off' }, at('2026-01-01T00:00:00Z'))).toEqual([]));
});

const row = (id: number, stepId: number | null, state: ExistingReminder['state'], due = '2026-03-12T08:00:00Z'): ExistingReminder => ({
	id,
	stepId,
	channel: 'email-step',
	dueAt: at(due),
	state,
	title: 'Feed'
});

describe('reconcileReminders', () => {
	const want = (stepId: number, due: string) => ({ stepId, channel: 'email-step' as const, dueAt: at(due), title: 'Feed' });

	it('inserts what is missing and leaves a matching row alone', () => {
		const c = reconcileReminders([row(10, 2, 'due')], [want(2, '2026-03-12T08:00:00Z'), want(3, '2026-06-03T08:00:00Z')]);
		expect(c).toEqual({ insert: [want(3, '2026-06-03T08:00:00Z')], update: [], skip: [] });
	});
	it('a moved step updates its unsent row', () => {
		const c = reconcileReminders([row(10, 2, 'due')], [want(2, '2026-03-15T08:00:00Z')]);
		expect(c.update).toEqual([{ ...want(2, '2026-03-15T08:00:00Z'), id: 10 }]);
		expect(c.insert).toEqual([]);
	});
	it('a sent, sending or failed step is never reminded again, wherever it moves', () => {
		for (const state of ['sent', 'sending', 'failed'] as const) {
			expect(reconcileReminders([row(10, 2, state)], [want(2, '2026-03-20T08:00:00Z')])).toEqual({ insert: [], update: [], skip: [] });
		}
	});
	it('unwanted due rows are skipped (reminders off, or the step left the plan); history is kept', () => {
		expect(reconcileReminders([row(10, 2, 'due'), row(11, null, 'due'), row(12, null, 'sent')], []).skip.sort()).toEqual([10, 11]);
	});
	it('turning reminders back on revives a skipped row instead of adding a second one', () => {
		const c = reconcileReminders([row(10, 2, 'skipped')], [want(2, '2026-03-12T08:00:00Z')]);
		expect(c).toEqual({ insert: [], update: [{ ...want(2, '2026-03-12T08:00:00Z'), id: 10 }], skip: [] });
	});
});
