import { requireUser } from '$lib/server/auth';
import { ownValueCount } from '$lib/catalogue/changes';
import { parametersOf } from '$lib/server/catalogue/mapping';
import { catalogueService } from '$lib/server/catalogue/service';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	requireUser(event, 'owner');
	const cultivars = (await catalogueService.cultivars(true)).map((c) => ({
		slug: c.cultivar.slug,
		name: c.cultivar.name,
		group: c.cultivar.group,
		subgroup: c.cultivar.subgroup,
		size: c.cultivar.size,
		builtIn: c.builtIn,
		retired: c.retired,
		usualPriceCents: c.usualPriceCents,
		ownValues: ownValueCount(parametersOf(c.cultivar))
	}));
	return { cultivars };
};
