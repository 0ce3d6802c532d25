import { error } from '@sveltejs/kit';
import { reminderService } from '$lib/server/reminders/service';
import type { Actions, PageServerLoad } from './$types';

// Public: opened from a reminder e-mail without signing in; the unguessable token in the link is the credential.
export const load: PageServerLoad = async ({ params }) => {
	if (!(await reminderService.knowsUnsubscribeToken(params.token))) error(404, 'This unsubscribe link is not valid');
	return {};
};

export const actions: Actions = {
	// Public: RFC 8058 one-click unsubscribe — mail providers POST "List-Unsubscribe=One-Click" here without cookies.
	default: async ({ params }) => {
		if (!(await reminderService.unsubscribe(params.token))) error(404, 'This unsubscribe link is not valid');
		return { unsubscribed: true };
	}
};
