import { pageQuery } from '$lib/schema/paging';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { guideService } from '$lib/server/guides/service';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event, ...STAFF_ROLES);
	const { size, ...asked } = pageQuery(event.url);
	const total = await guideService.count();
	const page = Math.min(asked.page, Math.max(1, Math.ceil(total / size)));
	return { guides: await guideService.listPage(size, (page - 1) * size), total, page, size, isOwner: me.role === 'owner' };
};
