import { redirect } from '@sveltejs/kit';
import { signInSchema, resetRequestSchema } from '$lib/schema/auth';
import { accounts } from '$lib/server/accounts/service';
import { startSession } from '$lib/server/auth';
import { runForm } from '$lib/server/forms';
import { HOME_FOR, safeNext } from '$lib/nav';
import type { Actions, PageServerLoad } from './$types';

// Public: the sign-in page itself.
export const load: PageServerLoad = ({ locals, url }) => {
	if (locals.user) redirect(303, safeNext(url.searchParams.get('next'), HOME_FOR[locals.user.role]));
	// Only a safe destination is carried into the form's own action (ASVS 3.7.2).
	return { next: safeNext(url.searchParams.get('next'), ''), reset: url.searchParams.get('reset') === 'done', verified: url.searchParams.get('verified') === '1' };
};

export const actions: Actions = {
	// Public: signing in is how one becomes a user.
	signin: async ({ request, cookies, getClientAddress, url }) => {
		const { failure, result: user } = await runForm(request, signInSchema, (data) => accounts.signIn(data, getClientAddress()));
		if (failure) return failure;
		await startSession(cookies, user.id);
		redirect(303, safeNext(url.searchParams.get('next'), HOME_FOR[user.role]));
	},
	// Public: a new verification link for an account that has not confirmed its e-mail.
	resend: async ({ request, getClientAddress }) => {
		const { failure } = await runForm(request, resetRequestSchema, (d) => accounts.resendVerification(d.email, getClientAddress()));
		return failure ?? { resent: true };
	}
};
