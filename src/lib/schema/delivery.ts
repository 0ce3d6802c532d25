/**
 * Delivery vocabulary (reminder modes, channels, states) and the inputs of the feeds API and the
 * /settings forms: one definition each, shared by pages, the API, the pg enums and the worker.
 */
import { z } from 'zod';
import { unitsField } from './plan';

/** How a gardener wants reminders: one message per step, one digest a week, or none. */
export const REMINDER_MODES = ['each-step', 'weekly-digest', 'off'] as const;
export type ReminderMode = (typeof REMINDER_MODES)[number];
export const REMINDER_MODE_LABELS: Record<ReminderMode, string> = {
	'each-step': 'An e-mail for each step, on the day its window opens',
	'weekly-digest': 'One e-mail a week listing the steps whose window opens that week (sent on Mondays)',
	off: 'No reminder e-mails'
};

/** The channel a reminder row goes out on; the mode a row was made for. */
export const REMINDER_CHANNELS = ['email-step', 'email-digest'] as const;
export type ReminderChannel = (typeof REMINDER_CHANNELS)[number];

/**
 * due: waiting for its time (or a retry); sending: claimed by a worker; sent: accepted by the mail
 * server; failed: refused for good or out of attempts; skipped: no longer wanted (reminders turned
 * off, step gone, or its window passed before it could be sent).
 */
export const REMINDER_STATES = ['due', 'sending', 'sent', 'failed', 'skipped'] as const;
export type ReminderState = (typeof REMINDER_STATES)[number];

export const SEND_HOUR_MIN = 0;
export const SEND_HOUR_MAX = 23;
export const DEFAULT_SEND_HOUR = 8;

/** IANA time zone names this runtime knows; the zod schema refuses the rest. */
export function isTimeZone(name: string): boolean {
	try {
		new Intl.DateTimeFormat('en', { timeZone: name });
		return name.length > 0 && name.length <= 64;
	} catch {
		return false;
	}
}

export const reminderSettingsSchema = z.object({
	mode: z.enum(REMINDER_MODES, { error: 'Choose how you want reminders' }),
	hour: z.coerce
		.number({ error: 'Choose the hour to send at' })
		.int('Choose a whole hour')
		.min(SEND_HOUR_MIN, 'Choose an hour from 0 to 23')
		.max(SEND_HOUR_MAX, 'Choose an hour from 0 to 23'),
	timeZone: z.string({ error: 'Choose your time zone' }).trim().refine(isTimeZone, 'Choose a time zone from the list'),
	units: unitsField
});
export type ReminderSettings = z.infer<typeof reminderSettingsSchema>;

const idField = (what: string) => z.coerce.number({ error: `Choose a ${what}` }).int(`Choose a ${what}`).positive(`Choose a ${what}`).max(2 ** 31 - 1, `Choose a ${what}`);

/** POST /api/v1/feeds and the settings form: one plant, or (without plantId) all the gardener's plants. */
export const newFeedSchema = z.object({ plantId: idField('plant').optional() }).strict();

/** The settings form's choice: "all" or a plant id. */
export const feedScopeFormSchema = z.object({
	scope: z.union([z.literal('all'), idField('plant')], { error: 'Choose all plants or one plant' })
});

/** The plant page's "add to my calendar" form: the plant comes from the path, the form has no fields. */
export const plantFeedFormSchema = z.object({});

export const feedIdSchema = z.object({ id: idField('feed') });

export const reminderIdSchema = z.object({ id: idField('reminder') });
