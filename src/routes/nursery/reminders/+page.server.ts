import { z } from 'zod';
import { REMINDER_STATES, reminderIdSchema } from '$lib/schema/delivery';
import { pageQuery } from '$lib/schema/paging';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { runForm } from '$lib/server/forms';
import { reminderService } from '$lib/server/reminders/service';
import type { Actions, PageServerLoad } from './$types';

const filterSchema = z.object({
	state: z.enum(REMINDER_STATES).optional().catch(undefined),
	plant: z.coerce.number().int().positive().max(2 ** 31 - 1).optional().catch(undefined)
});

export const load: PageServerLoad = async (event) => {
	requireUser(event, ...STAFF_ROLES);
	const { page, size } = pageQuery(event.url);
	const filter = filterSchema.parse({ state: event.url.searchParams.get('state') ?? undefined, plant: event.url.searchParams.get('plant') ?? undefined });
	const view = await reminderService.staffView({ state: filter.state, plantId: filter.plant }, page, size);
	return { ...view, size, filter: { state: filter.state ?? null, plant: filter.plant ?? null } };
};

export const actions: Actions = {
	resend: async (event) => {
		requireUser(event, ...STAFF_ROLES);
		const { failure } = await runForm(event.request, reminderIdSchema, ({ id }) => reminderService.resend(id));
		return failure ?? { resent: true };
	}
};
