import { changeRoleSchema, inviteSchema } from '$lib/schema/auth';
import { pageQuery } from '$lib/schema/paging';
import { accounts } from '$lib/server/accounts/service';
import { requireUser } from '$lib/server/auth';
import { runForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event, 'owner');
	const { size, ...asked } = pageQuery(event.url);
	const total = await accounts.countTeam();
	// A page past the end shows the last page rather than an empty table.
	const page = Math.min(asked.page, Math.max(1, Math.ceil(total / size)));
	const [people, invitations] = await Promise.all([accounts.listTeamPage(size, (page - 1) * size), accounts.listOpenInvitations()]);
	return { people, total, page, size, invitations, meId: me.id };
};

export const actions: Actions = {
	invite: async (event) => {
		const me = requireUser(event, 'owner');
		const { failure, result } = await runForm(event.request, inviteSchema, async (d) => (await accounts.invite(d, me.id), d.email));
		return failure ?? { invited: result };
	},
	role: async (event) => {
		const me = requireUser(event, 'owner');
		const { failure } = await runForm(event.request, changeRoleSchema, (d) => accounts.changeRole(d, me.id));
		return failure ?? { roleChanged: true };
	}
};
