import { redirect } from '@sveltejs/kit';
import { CULTIVAR_GROUPS } from '$lib/board/vocabulary';
import { GUIDE_STAGES } from '$lib/guides';
import { guideSchema } from '$lib/schema/guides';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { runForm } from '$lib/server/forms';
import { guideService } from '$lib/server/guides/service';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = (event) => {
	const me = requireUser(event, ...STAFF_ROLES);
	return { isOwner: me.role === 'owner', stages: GUIDE_STAGES, groups: CULTIVAR_GROUPS, replaceable: guideService.replaceable() };
};

export const actions: Actions = {
	default: async (event) => {
		const me = requireUser(event, ...STAFF_ROLES);
		const { failure, result } = await runForm(event.request, guideSchema, (d) => guideService.create(d, me));
		if (failure) return failure;
		redirect(303, `/nursery/guides/${result.id}?saved=1`);
	}
};
