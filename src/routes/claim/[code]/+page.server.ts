import { error, redirect } from '@sveltejs/kit';
import { claimSchema, STOCK_LIMITS } from '$lib/schema/stock';
import { requireUser } from '$lib/server/auth';
import { catalogueService } from '$lib/server/catalogue/service';
import { UserFacingError } from '$lib/server/errors';
import { runForm } from '$lib/server/forms';
import { addDays } from '$lib/server/plants/claim';
import { claimService, nurseryToday } from '$lib/server/sale-side';
import type { Actions, PageServerLoad } from './$types';

/** A refused look-up becomes the error page with its own status (404 unknown, 410 used, 429 too many). */
async function lookupOrError(code: string, ip: string, userId: number | null) {
	try {
		return await claimService.lookup(code, ip, userId);
	} catch (e) {
		if (e instanceof UserFacingError) error(e.status, e.message);
		throw e;
	}
}

// Public: the code from the care card is the credential; a visitor sees which plant it is before signing up or in.
export const load: PageServerLoad = async ({ params, locals, getClientAddress, url }) => {
	const plant = await lookupOrError(params.code, getClientAddress(), locals.user?.id ?? null);
	const signedIn = locals.user ? { name: locals.user.name, units: locals.user.units } : null;
	if (!signedIn) return { plant, signedIn, next: url.pathname, climates: [], today: '', latest: '' };
	const today = await nurseryToday();
	const climates = (await catalogueService.climates()).map((c) => ({ slug: c.climate.slug, name: c.climate.name, nurserys: c.nurserys, means: c.climate.monthlyMeanC }));
	// The nursery's own profiles first: most buyers garden near the nursery.
	climates.sort((a, b) => Number(b.nurserys) - Number(a.nurserys));
	return { plant, signedIn, next: url.pathname, climates, today, latest: addDays(today, STOCK_LIMITS.plantingAheadDays) };
};

export const actions: Actions = {
	default: async (event) => {
		const user = requireUser(event);
		const today = await nurseryToday();
		const { failure, result } = await runForm(event.request, claimSchema, (d) => claimService.claim(event.params.code, user.id, d, event.getClientAddress(), today));
		if (failure) return failure;
		redirect(303, `/plants?claimed=${result}`);
	}
};
