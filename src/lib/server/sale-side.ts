/**
 * The sale side wired to the app's database, configuration, mail and catalogue: stock, sales,
 * claims, plants and the waitlist. Services take these as parameters (so tests and the seed can
 * give their own); routes import the instances from here.
 */
import { catalogueService } from './catalogue/service';
import { config } from './config';
import { db } from './db';
import { consume, LIMITS, limitKeys } from './auth';
import { absoluteUrl, sendMail, type Message } from './mail';
import { nurseryService } from './nursery/service';
import { todayIso } from './plan-preview';
import { createClaimService } from './plants/claim';
import { regeneratePlan } from './plans/regenerate';
import { createPlantsService } from './plants/service';
import { createSalesService } from './sales/service';
import { claimSecret } from './secrets';
import { createStockService } from './stock/service';
import { createWaitlistService } from './waitlist/service';

/**
 * Sends within the per-address mail limit. A refusal or a mail server that is down resolves
 * false, so the caller can say so: the sale or stock change it follows is already committed.
 */
export async function mailWithinLimit(m: Message): Promise<boolean> {
	if (!(await consume(limitKeys.mailTo(m.to), LIMITS.mailsPerAddressee)).allowed) return false;
	try {
		await sendMail(m);
		return true;
	} catch (e) {
		console.error('[mail]', e instanceof Error ? e.message : e);
		return false;
	}
}

/** Today in the nursery's time zone: the sale date, the stall's day, the claim's "today". */
export async function nurseryToday(now = new Date()): Promise<string> {
	return todayIso(now, (await nurseryService.planningContext()).timeZone);
}

const nursery = () => nurseryService.publicProfile();

export const waitlistService = createWaitlistService({ db, link: absoluteUrl, mail: mailWithinLimit, nursery });

export const stockService = createStockService({
	db,
	onStockArrived: async (cultivarId) => {
		await waitlistService.notifyArrival(cultivarId);
	}
});

export const salesService = createSalesService({ db, secret: () => claimSecret(db, config), link: absoluteUrl, mail: mailWithinLimit, nursery });

export const claimService = createClaimService({
	db,
	consume,
	climateBySlug: catalogueService.climateBySlug,
	// The claimed plant's plan is stored once, here; its page, feeds and reminders read it.
	afterClaim: async (plantId) => {
		await db.transaction((tx) => regeneratePlan(tx, plantId, { kind: 'created' }));
	}
});

export const plantsService = createPlantsService({ db });
