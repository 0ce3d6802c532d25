/**
 * Plans as iCalendar (RFC 5545): the public plan preview and the stored plans behind a
 * gardener's subscribed feeds and reminder attachments. One piece of calendar code, written with
 * the writer in $lib/ics (fast folding, tested escaping).
 *
 * Each step is one all-day event on its `likely` day, not a block spanning earliest..latest:
 * windows run for weeks, and a weeks-long event fills the calendar's all-day row and reads as
 * "busy" the whole time. The window is written into the description instead. All-day DTEND is
 * exclusive (RFC 5545 §3.6.1), so it is the day after `likely`.
 *
 * Preview UIDs come from the plan's identity (what the caller says the plan is about, e.g.
 * cultivar and planting day) plus the step's kind, generation and its index among steps of that
 * kind and generation. Stored steps carry their own random UID, kept across regenerations, and a
 * SEQUENCE raised each time the step moves; their DTSTAMP and LAST-MODIFIED are the step's last
 * change, so the same plan always gives the same bytes.
 */
import { createHash } from 'node:crypto';
import { formatIsoDate, parseIsoDate, type Amount, type Nutrients, type Plan, type Step } from '$lib/care';
import { writeCalendar, type AllDayEvent } from '$lib/ics';
import { formatAmount, formatDay, formatNutrients, formatWindow, generationLabel } from '$lib/plan-text';

export const PRODID = '-//Bunchline//Care plan//EN';
/** How often subscribed calendars should fetch again: plans move with the weather, not by the minute. */
export const FEED_REFRESH = 'PT12H';

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

/** What a step's description needs: a computed step, or a stored one (where `restricted` is a flag). */
export interface DescribedStep extends Pick<Step, 'title' | 'detail' | 'earliest' | 'likely' | 'latest' | 'generation'> {
	amount?: Amount | null;
	nutrients?: Nutrients | null;
	cautions?: string[] | null;
	guide?: string | null;
	restricted?: { reason: string } | boolean | null;
}

const RESTRICTED_FLAG = 'Local rules limit nitrogen or phosphorus this month.';

export function dayAfter(iso: string): string {
	return formatIsoDate(parseIsoDate(iso) + 1);
}

function uidPrefix(identity: string): string {
	return createHash('sha256').update(identity).digest('hex').slice(0, 20);
}

/** The step in words: what to do, when, how much, every caution, and where to read more. */
export function stepDescription(step: DescribedStep, origin?: string, link?: string): string {
	const when = step.earliest === step.latest ? `On ${formatDay(step.likely)}` : `Likely ${formatDay(step.likely)}; window ${formatWindow(step)}`;
	const lines = [step.detail, '', `${generationLabel(step.generation)}. ${when}.`];
	if (step.amount) lines.push(`Amount: ${formatAmount(step.amount)}`);
	if (step.nutrients) lines.push(`Supplies: ${formatNutrients(step.nutrients)}`);
	for (const caution of step.cautions ?? []) lines.push(`Caution: ${caution}`);
	if (step.restricted) {
		const reason = typeof step.restricted === 'object' ? step.restricted.reason : RESTRICTED_FLAG;
		lines.push(`Restricted month: ${reason} You may skip this feeding.`);
	}
	if (step.guide && origin) lines.push(`Guide: ${origin}/guides/${step.guide}`);
	if (link) lines.push(`Your plant: ${link}`);
	return lines.join('\n');
}

export function planCalendar(plan: Plan, options: CalendarOptions): string {
	const prefix = uidPrefix(options.identity);
	const seen = new Map<string, number>();
	const stamp = options.stamp ?? new Date();
	const events = plan.steps.map((step): AllDayEvent => {
		const key = `${step.kind}-g${step.generation}`;
		const index = seen.get(key) ?? 0;
		seen.set(key, index + 1);
		return {
			uid: `${prefix}-${key}-${index}@bunchline`,
			stamp,
			start: step.likely,
			end: dayAfter(step.likely),
			summary: step.title,
			description: stepDescription(step, options.origin),
			...(step.guide && options.origin ? { url: `${options.origin}/guides/${step.guide}` } : {})
		};
	});
	return writeCalendar({ prodId: PRODID, name: options.name }, events);
}

/** A stored plan step with what a calendar shows about its plant. */
export interface StoredStep extends DescribedStep {
	uid: string;
	sequence: number;
	changedAt: Date;
	plantId: number;
	/** Names the plant in a calendar holding several, e.g. "Grand Nain #12". */
	plantLabel: string;
}

export interface StoredCalendarOptions {
	name: string;
	origin: string;
	/** Prefix each summary with the plant's label (a calendar of several plants). */
	labelPlants: boolean;
}

export function storedStepEvent(step: StoredStep, origin: string, labelPlant: boolean): AllDayEvent {
	const plantUrl = `${origin}/plants/${step.plantId}`;
	return {
		uid: `${step.uid}@bunchline`,
		stamp: step.changedAt,
		lastModified: step.changedAt,
		sequence: step.sequence,
		start: step.likely,
		end: dayAfter(step.likely),
		summary: labelPlant ? `${step.title} · ${step.plantLabel}` : step.title,
		description: stepDescription(step, origin, plantUrl),
		url: plantUrl
	};
}

/** Feeds and reminder attachments: the same event for a step wherever it appears. */
export function storedCalendar(steps: readonly StoredStep[], options: StoredCalendarOptions): string {
	return writeCalendar(
		{ prodId: PRODID, name: options.name, refreshInterval: FEED_REFRESH },
		steps.map((s) => storedStepEvent(s, options.origin, options.labelPlants))
	);
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
