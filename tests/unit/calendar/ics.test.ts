/**
 * The feed checked as a calendar app reads it: parsed by ical.js, against RFC 5545.
 */
import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import { climates, computePlan, cultivars, defaultFeeding, formatIsoDate, parseIsoDate, type Plan } from '$lib/care';
import { planCalendar } from '$lib/server/calendar';
import { previewCalendar } from '$lib/server/plan-preview';
import { builtInSnapshot } from '$lib/server/catalogue/snapshot';

function planFor(cultivarIndex: number, climateIndex: number, plantedOn = '2026-03-15'): Plan {
	return computePlan({
		cultivar: cultivars[cultivarIndex],
		plantedOn,
		ageAtPlantingWeeks: 12,
		climate: climates[climateIndex],
		feeding: defaultFeeding
	});
}

function parse(ics: string) {
	const calendar = new ICAL.Component(ICAL.parse(ics));
	return { calendar, events: calendar.getAllSubcomponents('vevent') };
}

const plan = planFor(0, 0);
const ics = planCalendar(plan, { identity: 'test|plant', name: 'Test plan', origin: 'http://bunchline.test', stamp: new Date(Date.UTC(2026, 0, 2, 3, 4, 5)) });
const { calendar, events } = parse(ics);

describe('VCALENDAR', () => {
	it('RFC 5545 §3.6: the object is a VCALENDAR with PRODID and VERSION 2.0 (§3.7.3, §3.7.4)', () => {
		expect(calendar.name).toBe('vcalendar');
		expect(calendar.getFirstPropertyValue('prodid')).toBe('-//Bunchline//Care plan//EN');
		expect(calendar.getFirstPropertyValue('version')).toBe('2.0');
	});

	it('RFC 5545 §3.6: one VEVENT per step', () => {
		expect(events).toHaveLength(plan.steps.length);
	});

	it('lines are CRLF-terminated and folded at 75 octets (RFC 5545 §3.1)', () => {
		const lines = ics.split('\r\n');
		expect(ics.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
		for (const line of lines) expect(new TextEncoder().encode(line).length).toBeLessThanOrEqual(75);
	});
});

describe('VEVENT', () => {
	it('RFC 5545 §3.6.1: every VEVENT has DTSTAMP and UID, and UIDs are unique (§3.8.4.7)', () => {
		const uids = events.map((e) => e.getFirstPropertyValue('uid'));
		for (const event of events) {
			expect(event.getFirstProperty('dtstamp')).toBeTruthy();
			expect(String(event.getFirstPropertyValue('uid'))).toMatch(/^\S+@bunchline$/);
		}
		expect(new Set(uids).size).toBe(events.length);
		expect(String(events[0].getFirstPropertyValue('dtstamp'))).toBe('2026-01-02T03:04:05Z');
	});

	it('RFC 5545 §3.6.1: all-day events have DTSTART as DATE and an exclusive DTEND, the day after the likely day', () => {
		events.forEach((event, i) => {
			const start = event.getFirstProperty('dtstart')!;
			const end = event.getFirstProperty('dtend')!;
			expect(start.type).toBe('date');
			expect(end.type).toBe('date');
			const step = plan.steps[i];
			expect(String(start.getFirstValue())).toBe(step.likely);
			expect(String(end.getFirstValue())).toBe(formatIsoDate(parseIsoDate(step.likely) + 1));
		});
	});

	it('RFC 5545 §3.8.1.12: SUMMARY is the step title', () => {
		events.forEach((event, i) => expect(event.getFirstPropertyValue('summary')).toBe(plan.steps[i].title));
	});

	it('RFC 5545 §3.8.1.5: DESCRIPTION carries detail, window, amount and every caution', () => {
		events.forEach((event, i) => {
			const step = plan.steps[i];
			const description = String(event.getFirstPropertyValue('description'));
			expect(description).toContain(step.detail);
			if (step.amount) expect(description).toContain(`${step.amount.value} ${step.amount.unit}`);
			for (const caution of step.cautions ?? []) expect(description).toContain(caution);
		});
	});
});

describe('stable UIDs', () => {
	const uidsOf = (p: Plan, identity: string) => parse(planCalendar(p, { identity, name: 'x' })).events.map((e) => String(e.getFirstPropertyValue('uid')));

	it('the same plan gives the same UIDs on every fetch, so a refresh updates instead of duplicating', () => {
		expect(uidsOf(plan, 'test|plant')).toEqual(uidsOf(plan, 'test|plant'));
	});

	it('a different climate for the same plant keeps the UIDs of matching steps', () => {
		const here = uidsOf(plan, 'test|plant');
		const elsewhere = new Set(uidsOf(planFor(0, 1), 'test|plant'));
		// Planting, and the first step of each kind and generation, exist in both plans.
		expect(here.filter((u) => elsewhere.has(u)).length).toBeGreaterThan(here.length / 2);
		expect(elsewhere.has(here[0])).toBe(true);
	});

	it('different plants never share UIDs', () => {
		const other = new Set(uidsOf(plan, 'test|other plant'));
		expect(uidsOf(plan, 'test|plant').some((u) => other.has(u))).toBe(false);
	});
});

describe('preview calendar for every cultivar and climate', () => {
	const catalogue = builtInSnapshot();
	cultivars.forEach((cultivar, ci) => {
		it(`${cultivar.slug}: parses in every climate, one event per step`, () => {
			climates.forEach((climate, li) => {
				const file = previewCalendar({ cultivar: cultivar.slug, plantedOn: '2026-03-15', ageAtPlantingWeeks: 12, climate: climate.slug }, catalogue);
				expect(file.filename).toMatch(/\.ics$/);
				expect(parse(file.ics).events).toHaveLength(planFor(ci, li).steps.length);
			});
		});
	});
});
