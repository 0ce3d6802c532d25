import { redirect } from '@sveltejs/kit';
import { endSession, requireUser } from '$lib/server/auth';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = (event) => {
	requireUser(event);
	redirect(303, '/');
};

export const actions: Actions = {
	default: async (event) => {
		const user = requireUser(event);
		if (user && event.locals.session) await endSession(event.cookies, event.locals.session.id);
		redirect(303, '/');
	}
};
