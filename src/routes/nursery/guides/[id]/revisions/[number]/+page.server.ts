import { error } from '@sveltejs/kit';
import { idParam } from '$lib/schema/board';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { guideService } from '$lib/server/guides/service';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, ...STAFF_ROLES);
	const id = idParam(event.params.id);
	const number = idParam(event.params.number);
	const guide = id ? await guideService.get(id) : undefined;
	const comparison = guide && number ? await guideService.compare(guide.id, number) : null;
	if (!guide || !comparison) error(404, 'No such revision');
	return { guide: { id: guide.id, title: guide.title }, ...comparison };
};
