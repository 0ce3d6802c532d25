import { redirect } from '@sveltejs/kit';
import { resetRequestSchema, resetSchema, tokenField } from '$lib/schema/auth';
import { accounts } from '$lib/server/accounts/service';
import { runForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

// Public: without a token, ask for a link; with one, choose a new password (if the link still works).
export const load: PageServerLoad = async ({ url }) => {
	const token = url.searchParams.get('token') ?? '';
	if (!token) return { token, live: false };
	return { token, live: tokenField.safeParse(token).success && (await accounts.resetLinkIsLive(token)) };
};

export const actions: Actions = {
	// Public: anyone may ask; the answer never says whether the account exists.
	request: async ({ request, getClientAddress }) => {
		const { failure } = await runForm(request, resetRequestSchema, (d) => accounts.requestPasswordReset(d.email, getClientAddress()));
		return failure ?? { requested: true };
	},
	// Public: the token is the credential.
	choose: async ({ request, getClientAddress }) => {
		const { failure } = await runForm(request, resetSchema, (d) => accounts.resetPassword(d, getClientAddress()));
		if (failure) return failure;
		redirect(303, '/login?reset=done');
	}
};
