import { redirect } from '@sveltejs/kit';
import { verifySchema } from '$lib/schema/auth';
import { accounts } from '$lib/server/accounts/service';
import { runForm } from '$lib/server/forms';
import { safeNext } from '$lib/nav';
import type { Actions, PageServerLoad } from './$types';

// Public: the e-mailed link lands here. Confirming takes a click (a POST), so link scanners
// that fetch the URL do not use up the token.
export const load: PageServerLoad = ({ url }) => ({ token: url.searchParams.get('token') ?? '' });

export const actions: Actions = {
	// Public: the token is the credential.
	default: async ({ request, url }) => {
		const { failure } = await runForm(request, verifySchema, (d) => accounts.verifyEmail(d.token));
		if (failure) return failure;
		const next = safeNext(url.searchParams.get('next'), '');
		redirect(303, `/login?verified=1${next ? `&next=${encodeURIComponent(next)}` : ''}`);
	}
};
