import { error } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth';
import { config } from '$lib/server/config';
import { listMail } from '$lib/server/devmail';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, 'owner');
	if (!config.devMailbox) error(404, 'Not found');
	return { messages: (await listMail()).map(({ body: _body, ...m }) => m) };
};
