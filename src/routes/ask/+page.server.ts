import { redirect } from '@sveltejs/kit';
import { askSchema } from '$lib/schema/questions';
import { requireUser } from '$lib/server/auth';
import { boardService } from '$lib/server/board/service';
import { runForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event, 'gardener');
	const [plants, mine] = await Promise.all([boardService.plantsOf(me), boardService.listMine(me)]);
	return { plants, mine, plantId: event.url.searchParams.get('plant') ?? '' };
};

export const actions: Actions = {
	default: async (event) => {
		const me = requireUser(event, 'gardener');
		const { failure, result } = await runForm(event.request, askSchema, (d) => boardService.ask(d, me));
		if (failure) return failure;
		redirect(303, `/questions/${result.id}?asked=1`);
	}
};
