/**
 * Stock, sales, claiming and the waitlist: the limits and input schemas shared by the pages (forms
 * send strings) and the JSON API (numbers), so both refuse the same input with the same words.
 */
import { z } from 'zod';
import { ID_MAX, lineField } from './fields';
import { emailField } from './auth';
import { isoDateField, monthlyMeansField, unitsField } from './plan';

/** Why a batch's count changed: every row of stock_movements has one of these. */
export const MOVEMENT_KINDS = ['received', 'adjusted', 'moved-out', 'moved-in', 'sold', 'undone'] as const;
export type MovementKind = (typeof MOVEMENT_KINDS)[number];

export const STOCK_LIMITS = {
	/** Plants in one batch: a nursery's bench, not a warehouse; larger numbers are typing slips. */
	batchCountMax: 10_000,
	/** Plants in one sale at the stall. */
	saleQuantityMax: 50,
	/** Price of one plant, in the nursery's currency. */
	priceMax: 10_000,
	reasonMax: 200,
	placeMax: 120,
	/** A sale can be undone this long after it was recorded (a slip noticed at the stall). */
	undoMinutes: 10,
	/** The planting date may be this many days after today at most ("not in the far future"). */
	plantingAheadDays: 90,
	/** Default planting date: the sale date plus this many days (a plant usually goes in that week). */
	plantingAfterSaleDays: 3
} as const;

/** Form inputs arrive as strings: blank means missing, a number-like string becomes a number. */
function numeric(value: unknown): unknown {
	if (typeof value !== 'string') return value;
	const v = value.trim();
	if (v === '') return undefined;
	return /^-?\d+(\.\d+)?$/.test(v) ? Number(v) : v;
}

const wholeNumber = (what: string, min: number, max: number) => {
	const message = `Enter a whole number of ${what} from ${min} to ${max}`;
	return z.preprocess(numeric, z.number({ error: message }).int(message).min(min, message).max(max, message));
};

const idField = (what: string) => z.preprocess(numeric, z.number({ error: `Choose ${what}` }).int(`Choose ${what}`).positive(`Choose ${what}`).max(ID_MAX, `Choose ${what}`));

const priceMessage = `Enter a price from 0 to ${STOCK_LIMITS.priceMax}, like 12.50`;
/** A price in currency units with at most two decimals; stored as whole cents. */
export const priceField = z.preprocess(
	numeric,
	z
		.number({ error: priceMessage })
		.min(0, priceMessage)
		.max(STOCK_LIMITS.priceMax, priceMessage)
		.refine((p) => Math.abs(p * 100 - Math.round(p * 100)) < 1e-6, 'Give the price to the cent at most, like 12.50')
);

export const toCents = (price: number) => Math.round(price * 100);
export const fromCents = (cents: number) => cents / 100;
/** "12.50": prices are shown with two decimals and no currency sign (the nursery's own currency). */
export const formatPrice = (cents: number) => (cents / 100).toFixed(2);

/** A cultivar's slug; control characters are refused here (a NUL byte would reach the query). */
const slugField = lineField({ required: 'Choose a cultivar', max: 80, tooLong: 'Choose a cultivar from the list' });

const optionalMarketDay = z.preprocess((v) => (v === '' || v === 'nursery' || v === null ? undefined : v), idField('a market day').optional());

/** POST /api/v1/stock and the stock page's receive form. */
export const receiveSchema = z.object({
	cultivar: slugField,
	count: wholeNumber('plants', 1, STOCK_LIMITS.batchCountMax),
	pottedOn: isoDateField,
	/** A market day's id; absent means at the nursery. */
	location: optionalMarketDay
});
export type ReceiveInput = z.infer<typeof receiveSchema>;

const reasonField = lineField({ required: 'Say why the count changed', max: STOCK_LIMITS.reasonMax, tooLong: `A reason has at most ${STOCK_LIMITS.reasonMax} characters` });

export const adjustSchema = z.object({
	batchId: idField('a batch'),
	change: z.preprocess(
		numeric,
		z
			.number({ error: 'Enter the change as a whole number, like -2 or 5' })
			.int('Enter the change as a whole number, like -2 or 5')
			.min(-STOCK_LIMITS.batchCountMax, 'That change is larger than any batch')
			.max(STOCK_LIMITS.batchCountMax, 'That change is larger than any batch')
			.refine((n) => n !== 0, 'A change of 0 changes nothing')
	),
	reason: reasonField
});

export const moveSchema = z.object({
	batchId: idField('a batch'),
	count: wholeNumber('plants', 1, STOCK_LIMITS.batchCountMax),
	/** Where to: a market day's id, or "nursery" to bring plants back. */
	to: z.preprocess((v) => (v === 'nursery' ? null : v), z.union([z.null(), idField('where the plants go')], { error: 'Choose where the plants go' }))
});

export const marketDaySchema = z.object({
	on: isoDateField,
	place: lineField({ required: 'Name the market', max: STOCK_LIMITS.placeMax, tooLong: `A place has at most ${STOCK_LIMITS.placeMax} characters` })
});

const optionalEmail = z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? undefined : v), emailField.optional());

/** POST /api/v1/sales and the stall (which sends the same fields, as strings when the form posts). */
export const saleSchema = z.object({
	batchId: idField('a batch'),
	quantity: wholeNumber('plants', 1, STOCK_LIMITS.saleQuantityMax),
	pricePerPlant: priceField,
	buyerEmail: optionalEmail,
	clientId: z.uuid({ error: 'clientId must be a UUID the client generated for this sale' })
});
export type SaleInput = z.infer<typeof saleSchema>;

export const saleIdSchema = z.object({ saleId: idField('a sale') });

/** A claim code: 160 bits in base32 (lower case, no padding), like every e-mailed token. */
export const CLAIM_CODE = /^[a-z2-7]{32}$/;
export const claimCodeField = z.string().regex(CLAIM_CODE, 'This claim code is not valid: check the card or the e-mail');

export const CUSTOM_CLIMATE_CHOICE = 'custom';

/** The claim form: planting date, the garden's climate (a profile or twelve means), units. */
export const claimSchema = z.preprocess(
	// The form always sends the twelve month inputs; they count only for "my own monthly means".
	(raw) => {
		if (!raw || typeof raw !== 'object') return raw;
		const { monthlyMeanC, ...rest } = raw as Record<string, unknown>;
		return rest.climate === CUSTOM_CLIMATE_CHOICE ? { ...rest, monthlyMeanC: Array.isArray(monthlyMeanC) ? monthlyMeanC.map(numeric) : monthlyMeanC } : rest;
	},
	z
		.object({
			plantedOn: isoDateField,
			climate: z.string({ error: 'Choose a climate' }).trim().min(1, 'Choose a climate').max(80, 'Choose a climate from the list'),
			monthlyMeanC: monthlyMeansField.optional(),
			units: unitsField
		})
		.superRefine((c, ctx) => {
			if (c.climate === CUSTOM_CLIMATE_CHOICE && !c.monthlyMeanC) {
				ctx.addIssue({ code: 'custom', path: ['monthlyMeanC'], message: 'Give 12 monthly mean temperatures, January first' });
			}
		})
);
export type ClaimInput = z.infer<typeof claimSchema>;

export const waitlistSchema = z.object({ cultivar: slugField, email: emailField });
