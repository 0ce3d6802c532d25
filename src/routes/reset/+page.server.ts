import { redirect } from '@sveltejs/kit';
import { resetRequestSchema, resetSchema } from '$lib/schema/auth';
import { accounts } from '$lib/server/accounts/service';
import { runForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

// Public: without a token, ask for a link; with one, choose a new password.
export const load: PageServerLoad = ({ url }) => ({ token: url.searchParams.get('token') ?? '' });

export const actions: Actions = {
	// Public: anyone may ask; the answer never says whether the account exists.
	request: async ({ request }) => {
		const { failure } = await runForm(request, resetRequestSchema, (d) => accounts.requestPasswordReset(d.email));
		return failure ?? { requested: true };
	},
	// Public: the token is the credential.
	choose: async ({ request }) => {
		const { failure } = await runForm(request, resetSchema, (d) => accounts.resetPassword(d));
		if (failure) return failure;
		redirect(303, '/login?reset=done');
	}
};
