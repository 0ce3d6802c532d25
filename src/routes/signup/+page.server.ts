import { redirect } from '@sveltejs/kit';
import { acceptInviteSchema, signUpSchema, tokenField } from '$lib/schema/auth';
import { accounts, INVITATION_STATE_TEXT } from '$lib/server/accounts/service';
import { startSession } from '$lib/server/auth';
import { runForm } from '$lib/server/forms';
import { HOME_FOR } from '$lib/nav';
import type { Actions, PageServerLoad } from './$types';

// Public: anyone may create a gardener account; an invitation link pre-fills a staff account.
export const load: PageServerLoad = async ({ url }) => {
	const token = url.searchParams.get('invite');
	if (!token) return { invite: null };
	const found = tokenField.safeParse(token).success ? await accounts.invitationState(token) : ({ state: 'unknown' } as const);
	if (found.state === 'live') return { invite: { token, email: found.email, role: found.role } };
	// A used, replaced or expired link says which, and what to do instead.
	return { invite: { token, closed: INVITATION_STATE_TEXT[found.state] } };
};

export const actions: Actions = {
	// Public: sign-up.
	create: async ({ request, getClientAddress }) => {
		const { failure, result } = await runForm(request, signUpSchema, (data) => accounts.signUp(data, getClientAddress()));
		return failure ?? { sentTo: result.email };
	},
	// Public: the invitation token is the credential.
	accept: async ({ request, cookies, getClientAddress }) => {
		const { failure, result: user } = await runForm(request, acceptInviteSchema, (data) => accounts.acceptInvitation(data, getClientAddress()));
		if (failure) return failure;
		await startSession(cookies, user.id);
		redirect(303, HOME_FOR[user.role]);
	}
};
