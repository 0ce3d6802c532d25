import { redirect } from '@sveltejs/kit';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { feeds, plantLabel } from '$lib/server/feeds/service';
import { feedShownOnce } from '$lib/server/feeds/shown';
import { reminderService } from '$lib/server/reminders/service';
import { plantFeedFormSchema, reminderIdSchema } from '$lib/schema/delivery';
import { runForm } from '$lib/server/forms';
import { catalogueService } from '$lib/server/catalogue/service';
import { plantIdOf, plantPage } from '$lib/server/plants/page';
import { plantService } from '$lib/server/plants/plant-service';
import { plantSettingsFormSchema } from '$lib/schema/plant';
import { z } from 'zod';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const user = requireUser(event);
	const view = await plantPage(user, event.params.id);
	const climates = view.access === 'edit' ? (await catalogueService.climates()).map((c) => ({ slug: c.climate.slug, name: c.climate.name })) : [];
	// The gardener gets this plant's calendar feeds; staff get what its reminders did (the nursery view's rows).
	const plantId = view.plant.id;
	const plantFeeds = view.access === 'edit' ? (await feeds.list(user.id)).filter((f) => f.plantId === plantId) : [];
	const reminders = view.access === 'view' ? await reminderService.staffView({ plantId }, 1, REMINDERS_SHOWN) : null;
	return { ...view, climates, plantFeeds, reminders };
};

/** Reminders listed on the plant page; the rest are one link away in the nursery view. */
const REMINDERS_SHOWN = 10;

const archiveSchema = z.object({ archived: z.enum(['true', 'false'], { error: 'Choose archive or restore' }) });

export const actions: Actions = {
	settings: async (event) => {
		const user = requireUser(event);
		const id = plantIdOf(event.params.id);
		const { failure } = await runForm(event.request, plantSettingsFormSchema, (data) => plantService.update(user, id, data));
		if (failure) return failure;
		redirect(303, `/plants/${id}?saved=settings`);
	},
	createFeed: async (event) => {
		const user = requireUser(event);
		const id = plantIdOf(event.params.id);
		const { failure, result } = await runForm(event.request, plantFeedFormSchema, () => feeds.create(user.id, id));
		if (failure) return failure;
		const [plant] = (await feeds.plantChoices(user.id)).filter((p) => p.id === id);
		return { newFeed: await feedShownOnce(result, plant?.label ?? plantLabel('Plant', id)) };
	},
	resend: async (event) => {
		requireUser(event, ...STAFF_ROLES);
		plantIdOf(event.params.id);
		const { failure } = await runForm(event.request, reminderIdSchema, ({ id }) => reminderService.resend(id));
		return failure ?? { resent: true };
	},
	archive: async (event) => {
		const user = requireUser(event);
		const id = plantIdOf(event.params.id);
		const { failure } = await runForm(event.request, archiveSchema, (data) => plantService.update(user, id, { archived: data.archived === 'true' }));
		if (failure) return failure;
		redirect(303, `/plants/${id}`);
	}
};
