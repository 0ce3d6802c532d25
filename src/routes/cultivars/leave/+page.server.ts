import { z } from 'zod';
import { tokenField } from '$lib/schema/auth';
import { runForm } from '$lib/server/forms';
import { waitlistService } from '$lib/server/sale-side';
import type { Actions, PageServerLoad } from './$types';

// Public: the link in the waitlist e-mail lands here; leaving takes one click (a POST), so link scanners that fetch the URL leave the entry alone.
export const load: PageServerLoad = async ({ url }) => {
	const token = url.searchParams.get('token') ?? '';
	const entry = tokenField.safeParse(token).success ? await waitlistService.entry(token) : undefined;
	return { token, entry: entry ?? null };
};

export const actions: Actions = {
	// Public: the token is the credential.
	default: async ({ request }) => {
		const { failure } = await runForm(request, z.object({ token: tokenField }), (d) => waitlistService.leave(d.token));
		return failure ?? { left: true };
	}
};
