/**
 * A plan as an iCalendar feed (RFC 5545).
 *
 * Each step is one all-day event on its `likely` day, not a block spanning earliest..latest:
 * windows run for weeks, and a weeks-long event fills the calendar's all-day row and reads as
 * "busy" the whole time. The window is written into the description instead. All-day DTEND is
 * exclusive (RFC 5545 §3.6.1), so it is the day after `likely`.
 *
 * UIDs come from the plan's identity (what the caller says the plan is about, e.g. cultivar and
 * planting day) plus the step's kind, generation and its index among steps of that kind and
 * generation. A refreshed or re-subscribed feed therefore carries the same UIDs, and calendar
 * apps move the existing events instead of adding copies.
 */
import { createHash } from 'node:crypto';
import ical, { ICalCalendarMethod } from 'ical-generator';
import { formatIsoDate, parseIsoDate, type Plan, type Step } from '$lib/care';
import { formatAmount, formatDay, formatNutrients, formatWindow, generationLabel } from '$lib/plan-text';

export interface CalendarOptions {
	/** Stable text naming the plan; equal identities give equal UIDs. */
	identity: string;
	/** Calendar name shown by calendar apps. */
	name: string;
	/** Site origin, for links to guides; omitted links are left out. */
	origin?: string;
	/** DTSTAMP; defaults to now. Fixed in tests. */
	stamp?: Date;
}

function dayAfter(iso: string): string {
	return formatIsoDate(parseIsoDate(iso) + 1);
}

function uidPrefix(identity: string): string {
	return createHash('sha256').update(identity).digest('hex').slice(0, 20);
}

export function stepDescription(step: Step, origin?: string): string {
	const when = step.earliest === step.latest ? `On ${formatDay(step.likely)}` : `Likely ${formatDay(step.likely)}; window ${formatWindow(step)}`;
	const lines = [step.detail, '', `${generationLabel(step.generation)}. ${when}.`];
	if (step.amount) lines.push(`Amount: ${formatAmount(step.amount)}`);
	if (step.nutrients) lines.push(`Supplies: ${formatNutrients(step.nutrients)}`);
	for (const caution of step.cautions ?? []) lines.push(`Caution: ${caution}`);
	if (step.restricted) lines.push(`Restricted month: ${step.restricted.reason} You may skip this feeding.`);
	if (step.guide && origin) lines.push(`Guide: ${origin}/guides/${step.guide}`);
	return lines.join('\n');
}

export function planCalendar(plan: Plan, options: CalendarOptions): string {
	const calendar = ical({
		prodId: { company: 'Bunchline', product: 'Care plan', language: 'EN' },
		name: options.name,
		method: ICalCalendarMethod.PUBLISH
	});
	const prefix = uidPrefix(options.identity);
	const seen = new Map<string, number>();
	for (const step of plan.steps) {
		const key = `${step.kind}-g${step.generation}`;
		const index = seen.get(key) ?? 0;
		seen.set(key, index + 1);
		calendar.createEvent({
			id: `${prefix}-${key}-${index}@bunchline`,
			stamp: options.stamp ?? new Date(),
			start: step.likely,
			end: dayAfter(step.likely),
			allDay: true,
			summary: step.title,
			description: stepDescription(step, options.origin),
			...(step.guide && options.origin ? { url: `${options.origin}/guides/${step.guide}` } : {})
		});
	}
	return calendar.toString();
}

export interface CalendarFile {
	filename: string;
	ics: string;
}

/** Served as an attachment so browsers save it; calendar apps subscribing ignore the disposition. */
export function icsResponse(file: CalendarFile): Response {
	return new Response(file.ics, {
		headers: {
			'content-type': 'text/calendar; charset=utf-8',
			'content-disposition': `attachment; filename="${file.filename}"`,
			'cache-control': 'no-cache'
		}
	});
}
