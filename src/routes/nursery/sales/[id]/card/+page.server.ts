import { error } from '@sveltejs/kit';
import QRCode from 'qrcode';
import { z } from 'zod';
import { computePlan } from '$lib/care';
import { cardLayout, firstWeeks } from '$lib/care-card';
import { emailField } from '$lib/schema/auth';
import { saleIdSchema } from '$lib/schema/stock';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { catalogueService } from '$lib/server/catalogue/service';
import { runForm } from '$lib/server/forms';
import { nurseryService } from '$lib/server/nursery/service';
import { defaultPlantingDate } from '$lib/server/plants/claim';
import { salesService } from '$lib/server/sale-side';
import { UserFacingError } from '$lib/server/errors';
import type { Actions, PageServerLoad } from './$types';

async function saleOr404(id: string) {
	const parsed = saleIdSchema.safeParse({ saleId: id });
	if (!parsed.success) error(404, 'No such sale');
	try {
		return await salesService.get(parsed.data.saleId);
	} catch (e) {
		if (e instanceof UserFacingError && e.status === 404) error(404, 'No such sale');
		throw e;
	}
}

export const load: PageServerLoad = async (event) => {
	requireUser(event, ...STAFF_ROLES);
	const { sale, plants } = await saleOr404(event.params.id);
	if (sale.undone) error(410, 'This sale was undone: its plants went back in stock and have no cards');
	const [{ feeding }, { defaultClimate }, profile, stored] = await Promise.all([
		nurseryService.planningContext(),
		catalogueService.settings(),
		nurseryService.publicProfile(),
		catalogueService.cultivarBySlug(sale.cultivar.slug)
	]);
	const climate = await catalogueService.climateBySlug(defaultClimate);
	// The card assumes planting a few days after the sale in the nursery's own climate; the steps
	// are worded in weeks after planting, so they hold whenever the buyer plants.
	const plantedOn = defaultPlantingDate(sale.soldOn);
	const steps =
		stored && climate
			? firstWeeks(
					computePlan({ cultivar: stored.cultivar, plantedOn, ageAtPlantingWeeks: plants[0]?.ageAtSaleWeeks ?? 0, climate: { monthlyMeanC: climate.climate.monthlyMeanC }, feeding }),
					plantedOn
				)
			: [];
	const cards = await Promise.all(
		plants.map(async (p, i) => ({
			...p,
			number: i + 1,
			// Inline SVG: sharp in print at any size, and no request leaves the page.
			qr: p.claimed ? null : await QRCode.toString(p.claimLink, { type: 'svg', errorCorrectionLevel: 'M', margin: 2 })
		}))
	);
	return { sale, cards, steps, nursery: profile, climateName: climate?.climate.name ?? defaultClimate, layout: cardLayout(event.url.searchParams.get('layout')) };
};

const resendSchema = z.object({ email: z.preprocess((v) => (v === '' ? undefined : v), emailField.optional()) });
const reissueSchema = z.object({ confirm: z.literal('yes', { error: 'Tick the box to confirm that the old cards and links stop working' }) });

export const actions: Actions = {
	resend: async (event) => {
		requireUser(event, ...STAFF_ROLES);
		const { sale } = await saleOr404(event.params.id);
		const { failure, result } = await runForm(event.request, resendSchema, (d) => salesService.resend(sale.id, d.email));
		return failure ?? { resentTo: result };
	},
	reissue: async (event) => {
		requireUser(event, ...STAFF_ROLES);
		const { sale } = await saleOr404(event.params.id);
		const { failure } = await runForm(event.request, reissueSchema, () => salesService.reissue(sale.id));
		return failure ?? { reissued: true };
	}
};
