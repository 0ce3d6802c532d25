import { changePasswordSchema } from '$lib/schema/auth';
import { accounts } from '$lib/server/accounts/service';
import { requireUser } from '$lib/server/auth';
import { runForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = (event) => {
	const me = requireUser(event);
	return { account: { name: me.name, email: me.email } };
};

export const actions: Actions = {
	password: async (event) => {
		const me = requireUser(event);
		const sessionId = event.locals.session!.id;
		const { failure } = await runForm(event.request, changePasswordSchema, (d) =>
			accounts.changePassword(d, { id: me.id, sessionId }, event.getClientAddress())
		);
		return failure ?? { passwordChanged: true };
	}
};
