import { publicAskerName } from '$lib/board/questions';
import { pageQuery } from '$lib/schema/paging';
import { boardService } from '$lib/server/board/service';
import type { PageServerLoad } from './$types';

// Public: answered questions their askers chose to share, first names only.
export const load: PageServerLoad = async (event) => {
	const { size, ...asked } = pageQuery(event.url);
	const total = await boardService.countPublic();
	const page = Math.min(asked.page, Math.max(1, Math.ceil(total / size)));
	const rows = await boardService.listPublic(size, (page - 1) * size);
	return {
		questions: rows.map((q) => ({ id: q.id, title: q.title, state: q.state, answeredAt: q.answeredAt, asker: publicAskerName(q.askerName), excerpt: q.bodyText.slice(0, 200) })),
		total,
		page,
		size,
		signedIn: Boolean(event.locals.user)
	};
};
