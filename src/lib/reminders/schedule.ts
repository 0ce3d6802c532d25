/**
 * When reminders go out, and how a changed plan or changed preferences change the reminder
 * table. Pure: the worker, the preference page and plan regeneration all call these rules.
 *
 * - Each step: one message on the day the step's window opens, at the gardener's hour in their
 *   time zone. A window already open gets its message at the next such hour; a window that has
 *   closed gets none.
 * - Weekly digest: the Monday on or before the window opens, at the gardener's hour; one message
 *   per gardener and Monday lists every step of that digest.
 * - A step that has been reminded (sent, or being sent) is never reminded again, whatever moves.
 */
import { formatIsoDate, parseIsoDate } from '../care/dates';
import type { IsoDate } from '../care/types';
import type { ReminderChannel, ReminderMode, ReminderState } from '../schema/delivery';

export interface Preferences {
	mode: ReminderMode;
	/** 0–23, local time. */
	hour: number;
	/** IANA time zone name. */
	timeZone: string;
}

export interface PlannedStep {
	id: number;
	title: string;
	earliest: IsoDate;
	latest: IsoDate;
}

export interface WantedReminder {
	stepId: number;
	channel: ReminderChannel;
	dueAt: Date;
	title: string;
}

const zoneFormats = new Map<string, Intl.DateTimeFormat>();
function zoneFormat(timeZone: string): Intl.DateTimeFormat {
	let f = zoneFormats.get(timeZone);
	if (!f) {
		f = new Intl.DateTimeFormat('en-US', { timeZone, hourCycle: 'h23', year: 'numeric', month: 'numeric', day: 'numeric', hour: 'numeric', minute: 'numeric', second: 'numeric' });
		zoneFormats.set(timeZone, f);
	}
	return f;
}

/** The wall-clock reading in a time zone at an instant, as if it were UTC (milliseconds). */
function wallClock(at: Date, timeZone: string): number {
	const parts = Object.fromEntries(zoneFormat(timeZone).formatToParts(at).map((p) => [p.type, p.value]));
	return Date.UTC(Number(parts.year), Number(parts.month) - 1, Number(parts.day), Number(parts.hour), Number(parts.minute), Number(parts.second));
}

/** The calendar date in a time zone at an instant. */
export function localDate(at: Date, timeZone: string): IsoDate {
	return new Date(wallClock(at, timeZone)).toISOString().slice(0, 10);
}

/**
 * The instant a local date and whole hour happen in a time zone (the time zone database via Intl).
 * An hour skipped by a clock change resolves to the instant one hour later on the wall clock; an
 * hour that happens twice resolves to its first occurrence.
 */
export function zonedInstant(day: IsoDate, hour: number, timeZone: string): Date {
	const wanted = Date.UTC(Number(day.slice(0, 4)), Number(day.slice(5, 7)) - 1, Number(day.slice(8, 10)), hour);
	const offsetAt = (t: number) => wallClock(new Date(t), timeZone) - t;
	// Guess with the offset at the wanted reading, then with the offset at that guess: one of them
	// is right unless the hour does not exist, and then the later one is the hour after the jump.
	const first = wanted - offsetAt(wanted);
	const second = wanted - offsetAt(first);
	const hits = [first, second, first - 3600_000, second - 3600_000].filter((t) => wallClock(new Date(t), timeZone) === wanted);
	return new Date(hits.length ? Math.min(...hits) : Math.max(first, second));
}

const addDays = (day: IsoDate, days: number) => formatIsoDate(parseIsoDate(day) + days);

/** Monday on or before a date (ISO 8601 weeks start on Monday). */
export function mondayOnOrBefore(day: IsoDate): IsoDate {
	const weekday = (new Date(`${day}T00:00:00Z`).getUTCDay() + 6) % 7; // Monday 0 … Sunday 6
	return addDays(day, -weekday);
}

/**
 * When a step's reminder is due, or null when none is wanted any more: the first send slot
 * (each `stride` days from `first`) that is not in the past and not after the window closes.
 */
function firstSlot(first: IsoDate, stride: number, latest: IsoDate, prefs: Preferences, now: Date): Date | null {
	let day = first;
	let due = zonedInstant(day, prefs.hour, prefs.timeZone);
	if (due < now) {
		const today = localDate(now, prefs.timeZone);
		const behind = Math.max(0, Math.floor((parseIsoDate(today) - parseIsoDate(first)) / stride) * stride);
		day = addDays(first, behind);
		due = zonedInstant(day, prefs.hour, prefs.timeZone);
		while (due < now) {
			day = addDays(day, stride);
			due = zonedInstant(day, prefs.hour, prefs.timeZone);
		}
	}
	return day > latest ? null : due;
}

export function wantedReminders(steps: readonly PlannedStep[], prefs: Preferences, now: Date): WantedReminder[] {
	if (prefs.mode === 'off') return [];
	const channel: ReminderChannel = prefs.mode === 'each-step' ? 'email-step' : 'email-digest';
	const out: WantedReminder[] = [];
	for (const step of steps) {
		const dueAt = prefs.mode === 'each-step' ? firstSlot(step.earliest, 1, step.latest, prefs, now) : firstSlot(mondayOnOrBefore(step.earliest), 7, step.latest, prefs, now);
		if (dueAt) out.push({ stepId: step.id, channel, dueAt, title: step.title });
	}
	return out;
}

export interface ExistingReminder {
	id: number;
	stepId: number | null;
	channel: ReminderChannel;
	dueAt: Date;
	state: ReminderState;
	title: string;
}

export interface ReminderChanges {
	insert: WantedReminder[];
	/** Unsent rows given a new time, channel or title (and made due again if they were skipped). */
	update: (WantedReminder & { id: number })[];
	/** Unsent rows no longer wanted. */
	skip: number[];
}

/**
 * What to write so the table matches what is wanted, for one plant. Rows that were sent, are
 * being sent, or failed are history and are never touched; a step with such a row gets no new one.
 */
export function reconcileReminders(existing: readonly ExistingReminder[], wanted: readonly WantedReminder[]): ReminderChanges {
	const changes: ReminderChanges = { insert: [], update: [], skip: [] };
	const wantedByStep = new Map(wanted.map((w) => [w.stepId, w]));
	const byStep = new Map<number, ExistingReminder[]>();
	for (const row of existing) {
		if (row.stepId === null) {
			// The step left the plan.
			if (row.state === 'due') changes.skip.push(row.id);
		} else byStep.set(row.stepId, [...(byStep.get(row.stepId) ?? []), row]);
	}
	for (const [stepId, rows] of byStep) {
		const settled = rows.some((r) => r.state === 'sent' || r.state === 'sending' || r.state === 'failed');
		const want = settled ? undefined : wantedByStep.get(stepId);
		wantedByStep.delete(stepId);
		const same = (r: ExistingReminder) => want !== undefined && r.channel === want.channel && r.dueAt.getTime() === want.dueAt.getTime();
		// Reuse the row already at the wanted time (the key is unique), else a due one, else a skipped one.
		const reuse = want ? (rows.find(same) ?? rows.find((r) => r.state === 'due') ?? rows.find((r) => r.state === 'skipped')) : undefined;
		for (const r of rows) if (r.state === 'due' && r !== reuse) changes.skip.push(r.id);
		if (want && reuse && (reuse.state !== 'due' || !same(reuse) || reuse.title !== want.title)) changes.update.push({ ...want, id: reuse.id });
	}
	changes.insert.push(...wantedByStep.values());
	return changes;
}
