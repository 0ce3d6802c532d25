/**
 * Reminder preferences and the reminder table kept in step with plans. `syncPlantReminders` runs
 * inside plan regeneration's transaction (a moved step moves its unsent reminder; a sent one is
 * never sent again) and after a gardener changes preferences.
 */
import { DEFAULT_SEND_HOUR, type ReminderSettings } from '../../schema/delivery';
import { reconcileReminders, wantedReminders } from '../../reminders/schedule';
import { newToken } from '../auth/tokens';
import { db } from '../db';
import type { Conn, Tx } from '../db/tx';
import { UserFacingError } from '../errors';
import { nurseryService } from '../nursery/service';
import { regeneratePlan } from '../plans/regenerate';
import { reminderRepository, type PreferenceRow, type ReminderRepository, type StaffFilter } from './repository';

export interface ReminderServiceDeps {
	repo: ReminderRepository;
	/** The nursery's time zone: a gardener's until they choose their own. */
	defaultTimeZone: () => Promise<string>;
	now: () => Date;
	/** Re-plans a plant inside a transaction (units changed). */
	regenerate?: (tx: Tx, plantId: number) => Promise<unknown>;
}

export function createReminderService(deps: ReminderServiceDeps) {
	const { repo } = deps;

	async function preferencesOf(c: Conn, userId: number): Promise<PreferenceRow> {
		return (
			(await repo.preferences(c, userId)) ??
			repo.ensurePreferences(c, { userId, mode: 'each-step', hour: DEFAULT_SEND_HOUR, timeZone: await deps.defaultTimeZone(), unsubscribeToken: newToken() })
		);
	}

	async function syncPlant(c: Conn, plantId: number): Promise<void> {
		const now = deps.now();
		const plant = await repo.plant(c, plantId);
		const existing = await repo.ofPlant(c, plantId);
		if (!plant?.gardenerId || plant.archivedAt) {
			await repo.apply(c, plantId, 0, reconcileReminders(existing, []), now);
			return;
		}
		const prefs = await preferencesOf(c, plant.gardenerId);
		const steps = await repo.steps(c, plantId);
		await repo.apply(c, plantId, plant.gardenerId, reconcileReminders(existing, wantedReminders(steps, prefs, now)), now);
	}

	async function syncGardener(c: Conn, userId: number): Promise<void> {
		for (const plantId of await repo.plantsOf(c, userId)) await syncPlant(c, plantId);
	}

	return {
		syncPlant,
		preferences: (userId: number) => preferencesOf(db, userId),

		/** What the settings page shows: the saved choices, or the defaults, without writing anything. */
		async choices(userId: number) {
			const saved = await repo.preferences(db, userId);
			return saved ? { mode: saved.mode, hour: saved.hour, timeZone: saved.timeZone } : { mode: 'each-step' as const, hour: DEFAULT_SEND_HOUR, timeZone: await deps.defaultTimeZone() };
		},

		/** Saves the choices and re-plans every unsent reminder of the gardener's plants, in one transaction. */
		async save(userId: number, input: ReminderSettings): Promise<void> {
			await db.transaction(async (tx) => {
				await preferencesOf(tx, userId);
				await repo.savePreferences(tx, userId, { mode: input.mode, hour: input.hour, timeZone: input.timeZone }, deps.now());
				await repo.setUnits(tx, userId, input.units);
				// Amounts in the plans follow the gardener's units; regeneration also re-syncs reminders.
				if (deps.regenerate) {
					for (const plantId of await repo.plantsInOtherUnits(tx, userId, input.units)) {
						await repo.setPlantUnits(tx, plantId, input.units);
						await deps.regenerate(tx, plantId);
					}
				}
				await syncGardener(tx, userId);
			});
		},

		/** One-click unsubscribe (RFC 8058): reminders off, every unsent one skipped. */
		async unsubscribe(token: string): Promise<boolean> {
			const prefs = await repo.byUnsubscribeToken(token);
			if (!prefs) return false;
			await db.transaction(async (tx) => {
				await repo.savePreferences(tx, prefs.userId, { mode: 'off', hour: prefs.hour, timeZone: prefs.timeZone }, deps.now());
				await syncGardener(tx, prefs.userId);
			});
			return true;
		},

		knowsUnsubscribeToken: async (token: string) => (await repo.byUnsubscribeToken(token)) !== undefined,

		async staffView(filter: StaffFilter, page: number, size: number) {
			const total = await repo.staffCount(filter);
			const last = Math.max(1, Math.ceil(total / size));
			const shown = Math.min(page, last);
			const [rows, counts] = await Promise.all([repo.staffPage(filter, size, (shown - 1) * size), repo.countsByState(filter.plantId)]);
			return { rows, counts, total, page: shown };
		},

		async resend(id: number): Promise<void> {
			if (!(await repo.resend(id, deps.now()))) throw new UserFacingError('id', 'Only a failed reminder can be sent again', 409);
		}
	};
}

export const reminderService = createReminderService({
	repo: reminderRepository,
	defaultTimeZone: async () => (await nurseryService.planningContext()).timeZone,
	now: () => new Date(),
	regenerate: (tx, plantId) => regeneratePlan(tx, plantId, { kind: 'units' })
});
