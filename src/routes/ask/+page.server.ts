import { redirect } from '@sveltejs/kit';
import { askSchema } from '$lib/schema/questions';
import { requireUser } from '$lib/server/auth';
import { boardService } from '$lib/server/board/service';
import { filesOf, runFormData } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event, 'gardener');
	const [plants, mine] = await Promise.all([boardService.plantsOf(me), boardService.listMine(me)]);
	return { plants, mine, plantId: event.url.searchParams.get('plant') ?? '' };
};

export const actions: Actions = {
	default: async (event) => {
		const me = requireUser(event, 'gardener');
		const form = await event.request.formData().catch(() => new FormData());
		const { failure, result } = await runFormData(form, askSchema, (d) => boardService.ask(d, me, filesOf(form, 'photos')));
		if (failure) return failure;
		redirect(303, `/questions/${result.id}?asked=1`);
	}
};
