import { changeRoleSchema, inviteSchema, roleInSentence } from '$lib/schema/auth';
import { pageQuery } from '$lib/schema/paging';
import { accounts } from '$lib/server/accounts/service';
import { requireUser } from '$lib/server/auth';
import { runForm } from '$lib/server/forms';
import { UserFacingError } from '$lib/server/errors';
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
		const { failure, result } = await runForm(event.request, inviteSchema, async (d) => (await accounts.invite(d, me.id), d));
		return failure ?? { invited: result };
	},
	/** Two steps: the first answers with what would change and asks; the confirmed one changes it. */
	role: async (event) => {
		const me = requireUser(event, 'owner');
		const { failure, result } = await runForm(event.request, changeRoleSchema, async (d) => {
			if (d.confirmed) return { roleChanged: await accounts.changeRole(d, me.id) };
			const person = await accounts.findPerson(d.userId);
			if (!person) throw new UserFacingError('userId', 'No such person', 404);
			if (person.role === d.role) throw new UserFacingError('role', `${person.name} already is ${roleInSentence(d.role)}`);
			return { confirmRole: { userId: person.id, name: person.name, from: person.role, to: d.role, self: person.id === me.id } };
		});
		return failure ?? result;
	}
};
