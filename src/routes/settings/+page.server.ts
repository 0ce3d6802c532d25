import { feedIdSchema, feedScopeFormSchema, reminderSettingsSchema } from '$lib/schema/delivery';
import { requireUser } from '$lib/server/auth';
import { feeds } from '$lib/server/feeds/service';
import { feedShownOnce } from '$lib/server/feeds/shown';
import { runForm } from '$lib/server/forms';
import { reminderService } from '$lib/server/reminders/service';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireUser(event);
	const [feedList, plants, choices] = await Promise.all([feeds.list(user.id), feeds.plantChoices(user.id), reminderService.choices(user.id)]);
	return { feeds: feedList, plants, reminders: { ...choices, units: user.units }, timeZones: TIME_ZONES };
};

/** The new address, shown once, with a QR code of its webcal:// form. */
const shown = async (feed: { https: string; webcal: string }, scope: string) => ({ newFeed: await feedShownOnce(feed, scope) });

const scopeLabel = (plants: { id: number; label: string }[], plantId: number | null) =>
	plantId === null ? 'all your plants' : (plants.find((p) => p.id === plantId)?.label ?? 'this plant');

/** Every IANA zone this runtime knows, for the time zone picker (UTC first). */
const TIME_ZONES = ['UTC', ...Intl.supportedValuesOf('timeZone').filter((z) => z !== 'UTC')];

export const actions: Actions = {
	saveReminders: async (event) => {
		const user = requireUser(event);
		const { failure } = await runForm(event.request, reminderSettingsSchema, (input) => reminderService.save(user.id, input));
		return failure ?? { saved: true };
	},
	createFeed: async (event) => {
		const user = requireUser(event);
		const { failure, result } = await runForm(event.request, feedScopeFormSchema, async ({ scope }) => {
			const plantId = scope === 'all' ? undefined : scope;
			return { feed: await feeds.create(user.id, plantId), plantId: plantId ?? null };
		});
		if (failure) return failure;
		return shown(result.feed, scopeLabel(await feeds.plantChoices(user.id), result.plantId));
	},
	rotateFeed: async (event) => {
		const user = requireUser(event);
		const { failure, result } = await runForm(event.request, feedIdSchema, ({ id }) => feeds.rotate(user.id, id));
		if (failure) return failure;
		const feed = (await feeds.list(user.id)).find((f) => f.id === result.id);
		return shown(result, feed?.plantId ? feed.scope : 'all your plants');
	},
	revokeFeed: async (event) => {
		const user = requireUser(event);
		const { failure } = await runForm(event.request, feedIdSchema, ({ id }) => feeds.revoke(user.id, id));
		return failure ?? { revoked: true };
	}
};
