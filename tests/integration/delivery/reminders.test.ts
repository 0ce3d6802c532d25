/**
 * Reminders as the table records them: made by plan regeneration, moved when the plan moves,
 * never re-sent, following the gardener's preferences, and the message a gardener receives
 * (text and HTML, the step's .ics, RFC 8058 one-click unsubscribe, deterministic Message-ID).
 */
import { and, eq, sql } from 'drizzle-orm';
import ICAL from 'ical.js';
import { beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { readdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { db } from '../../../src/lib/server/db';
import { planSteps, plants, reminderPreferences, reminders } from '../../../src/lib/server/db/schema';
import { regeneratePlan } from '../../../src/lib/server/plans/regenerate';
import { createDispatcher } from '../../../src/lib/server/reminders/dispatch';
import { reminderRepository } from '../../../src/lib/server/reminders/repository';
import { reminderService } from '../../../src/lib/server/reminders/service';
import { localDate, mondayOnOrBefore, zonedInstant } from '../../../src/lib/reminders/schedule';
import { reminderTransport } from '../../../src/lib/server/reminders/worker';
import { actions as unsubscribeActions, load as unsubscribeLoad } from '../../../src/routes/unsubscribe/[token]/+page.server';
import { insertGardener, insertPlant } from '../../helpers/plants';

const today = localDate(new Date(), 'UTC');
const rowsOf = (plantId: number) => db.select().from(reminders).where(eq(reminders.plantId, plantId)).orderBy(reminders.id);

let gardener: Awaited<ReturnType<typeof insertGardener>>;
let plantId: number;

beforeAll(async () => {
	gardener = await insertGardener('Rem');
	plantId = (await insertPlant({ gardenerId: gardener.id, plantedOn: today })).id;
});

describe('reminders follow the stored plan', () => {
	it('claiming and planting makes one due reminder per step whose window has not closed, on the morning the window opens', async () => {
		const steps = await db.select().from(planSteps).where(eq(planSteps.plantId, plantId));
		const rows = await rowsOf(plantId);
		// A window still has a slot when its last morning's 08:00 is not yet past (after 08:00 UTC the
		// planting step, whose window is today only, has none left).
		const open = steps.filter((s) => zonedInstant(s.latest, 8, 'UTC').getTime() >= Date.now());
		expect(rows).toHaveLength(open.length);
		expect(rows.length).toBeGreaterThan(20);
		const now = Date.now();
		for (const row of rows) {
			const step = steps.find((s) => s.id === row.stepId)!;
			expect(row.state).toBe('due');
			expect(row.channel).toBe('email-step');
			const opening = zonedInstant(step.earliest, 8, 'UTC').getTime();
			// The window's first morning, or (for a window already open) the next 08:00.
			expect(row.dueAt.getTime() === opening || (opening < now && row.dueAt.getTime() - now <= 24 * 3600_000)).toBe(true);
		}
	});

	it('regenerating a plan moves unsent reminders with their steps and never re-sends a sent one', async () => {
		const before = await rowsOf(plantId);
		const sent = before[before.length - 1];
		await db.update(reminders).set({ state: 'sent', sentAt: new Date(), messageId: '<already@bunchline.test>' }).where(eq(reminders.id, sent.id));
		// The gardener corrects the planting day: every step moves later.
		const moved = localDate(new Date(Date.now() + 20 * 86400_000), 'UTC');
		await db.transaction(async (tx) => {
			await tx.update(plants).set({ plantedOn: moved }).where(eq(plants.id, plantId));
			await regeneratePlan(tx, plantId, { kind: 'planting-date' });
		});
		const after = await rowsOf(plantId);
		const sentAfter = after.find((r) => r.id === sent.id)!;
		expect(sentAfter).toMatchObject({ state: 'sent', messageId: '<already@bunchline.test>' });
		expect(sentAfter.dueAt.getTime()).toBe(sent.dueAt.getTime());
		expect(after.filter((r) => r.stepId === sent.stepId)).toHaveLength(1);
		const steps = await db.select().from(planSteps).where(eq(planSteps.plantId, plantId));
		let movedCount = 0;
		for (const row of after.filter((r) => r.state === 'due')) {
			const step = steps.find((s) => s.id === row.stepId)!;
			expect(row.dueAt.toISOString()).toBe(zonedInstant(step.earliest, 8, 'UTC').toISOString());
			if (before.find((b) => b.id === row.id && b.dueAt.getTime() !== row.dueAt.getTime())) movedCount++;
		}
		expect(movedCount).toBeGreaterThan(10);
	});
});

describe('preferences', () => {
	it('a weekly digest moves unsent reminders to the Monday at the chosen hour in the chosen zone; off skips them; on again revives them', async () => {
		await reminderService.save(gardener.id, { mode: 'weekly-digest', hour: 7, timeZone: 'America/New_York', units: 'metric' });
		const steps = await db.select().from(planSteps).where(eq(planSteps.plantId, plantId));
		const digest = (await rowsOf(plantId)).filter((r) => r.state === 'due');
		expect(digest.length).toBeGreaterThan(10);
		for (const row of digest) {
			const step = steps.find((s) => s.id === row.stepId)!;
			expect(row.channel).toBe('email-digest');
			expect(row.dueAt.toISOString()).toBe(zonedInstant(mondayOnOrBefore(step.earliest), 7, 'America/New_York').toISOString());
		}
		await reminderService.save(gardener.id, { mode: 'off', hour: 7, timeZone: 'America/New_York', units: 'metric' });
		const off = await rowsOf(plantId);
		expect(off.filter((r) => r.state === 'due')).toHaveLength(0);
		expect(off.filter((r) => r.state === 'sent')).toHaveLength(1);
		await reminderService.save(gardener.id, { mode: 'each-step', hour: 8, timeZone: 'UTC', units: 'metric' });
		const on = await rowsOf(plantId);
		expect(on).toHaveLength(off.length);
		expect(on.filter((r) => r.state === 'due').length).toBe(digest.length);
	});

	it('switching units re-plans the plant: feeding amounts are then in ounces', async () => {
		await reminderService.save(gardener.id, { mode: 'each-step', hour: 8, timeZone: 'UTC', units: 'imperial' });
		const feeding = await db.select().from(planSteps).where(and(eq(planSteps.plantId, plantId), eq(planSteps.kind, 'feeding')));
		expect(feeding.every((s) => s.amount === null || s.amount.unit === 'oz' || s.amount.unit === 'lb')).toBe(true);
		expect(feeding.some((s) => s.amount !== null)).toBe(true);
		await reminderService.save(gardener.id, { mode: 'each-step', hour: 8, timeZone: 'UTC', units: 'metric' });
	});
});

describe('the message', () => {
	it('has text and HTML, the step as .ics, cautions, one-click unsubscribe headers and its deterministic Message-ID; the link unsubscribes in one POST', async () => {
		// A step with cautions, due now.
		const [row] = await db
			.select({ id: reminders.id, stepId: reminders.stepId })
			.from(reminders)
			.innerJoin(planSteps, eq(planSteps.id, reminders.stepId))
			.where(and(eq(reminders.plantId, plantId), eq(reminders.state, 'due'), sql`jsonb_array_length(coalesce(${planSteps.cautions}, '[]'::jsonb)) > 0`))
			.limit(1);
		await db.update(reminders).set({ dueAt: new Date(Date.now() - 60_000) }).where(eq(reminders.id, row.id));
		const transport = reminderTransport();
		const dispatcher = createDispatcher(
			reminderRepository,
			{ send: async (m) => void (await transport.sendMail({ ...m })) },
			{ leaseMs: 60_000, retryBaseMs: 1000, maxAttempts: 3, batchSize: 50, pickLimit: 100, concurrency: 2, mail: { from: 'Bunchline <plans@bunchline.test>', origin: 'http://bunchline.test' }, messageDomain: 'bunchline.test' }
		);
		const queued: number[][] = [];
		await dispatcher.tick(async (b) => void queued.push(...b));
		expect(queued.flat()).toContain(row.id);
		await dispatcher.send([row.id]);
		transport.close();
		const [done] = await db.select().from(reminders).where(eq(reminders.id, row.id));
		expect(done).toMatchObject({ state: 'sent', attempts: 1, messageId: `<reminder-${row.id}@bunchline.test>` });

		const dir = inject('mailDir');
		let raw = '';
		for (let i = 0; i < 100 && !raw; i++) {
			for (const name of await readdir(dir)) {
				const text = await readFile(join(dir, name), 'utf8');
				if (text.includes(`<reminder-${row.id}@bunchline.test>`)) raw = text;
			}
			if (!raw) await new Promise((r) => setTimeout(r, 100));
		}
		expect(raw).toMatch(/^Message-ID: <reminder-\d+@bunchline\.test>/im);
		expect(raw).toMatch(/^Content-Type: text\/plain/im);
		expect(raw).toMatch(/^Content-Type: text\/html/im);
		expect(raw).toMatch(/^List-Unsubscribe-Post: List-Unsubscribe=One-Click/im);
		const unsubscribe = raw.match(/^List-Unsubscribe:\s+<(http:\/\/bunchline\.test\/unsubscribe\/([a-z2-7]+))>/im);
		expect(unsubscribe).not.toBeNull();
		const ics = raw.match(/Content-Type: text\/calendar[^]*?\r\n\r\n([^]*?)\r\n--/)![1];
		const decoded = /Content-Transfer-Encoding: base64/i.test(raw.slice(raw.indexOf('Content-Type: text/calendar'))) ? Buffer.from(ics.replace(/\s+/g, ''), 'base64').toString('utf8') : ics;
		const event = new ICAL.Component(ICAL.parse(decoded)).getFirstSubcomponent('vevent')!;
		const [step] = await db.select().from(planSteps).where(eq(planSteps.id, row.stepId!));
		expect(event.getFirstPropertyValue('uid')).toBe(`${step.uid}@bunchline`);
		expect(String(event.getFirstPropertyValue('description'))).toContain(step.cautions![0]);
		expect(raw.replace(/=\r?\n/g, '')).toContain('Caution:');

		// RFC 8058: a POST to the List-Unsubscribe URL, with no cookie, turns reminders off.
		const token = unsubscribe![2];
		const params = { token };
		await expect(unsubscribeLoad({ params } as never)).resolves.toEqual({});
		await unsubscribeActions.default({ params, request: new Request('http://bunchline.test/unsubscribe/' + token, { method: 'POST', body: 'List-Unsubscribe=One-Click' }) } as never);
		const [prefs] = await db.select().from(reminderPreferences).where(eq(reminderPreferences.userId, gardener.id));
		expect(prefs.mode).toBe('off');
		expect((await rowsOf(plantId)).filter((r) => r.state === 'due')).toHaveLength(0);
		await expect(unsubscribeLoad({ params: { token: 'nope' } } as never)).rejects.toMatchObject({ status: 404 });
	});
});
