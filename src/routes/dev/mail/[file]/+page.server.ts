import { error } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth';
import { config } from '$lib/server/config';
import { readMail } from '$lib/server/devmail';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, 'owner');
	if (!config.devMailbox) error(404, 'Not found');
	const message = await readMail(event.params.file);
	if (!message) error(404, 'No such message');
	return { message };
};
