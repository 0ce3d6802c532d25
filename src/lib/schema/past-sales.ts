/**
 * Importing past sales from a spreadsheet: the file's columns, its limits and one row's rules,
 * shared by the import page (template, size check) and the server (every row validated).
 */
import { z } from 'zod';
import { emailField } from './auth';
import { lineField } from './fields';
import { AGE_MAX_WEEKS, isoDateField } from './plan';
import { priceField, STOCK_LIMITS } from './stock';

/** The header row, in order; the template offers exactly this. */
export const PAST_SALE_COLUMNS = ['cultivar', 'sale date', 'age at sale (weeks)', 'buyer e-mail', 'price', 'market'] as const;
export type PastSaleColumn = (typeof PAST_SALE_COLUMNS)[number];

/** Below adapter-node's default request limit (512 KiB), so the app's own message is the one shown: about 6,000 rows. */
export const IMPORT_MAX_BYTES = 500 * 1024;
export const IMPORT_MAX_ROWS = 10_000;

export const PAST_SALES_TEMPLATE = [
	PAST_SALE_COLUMNS.join(','),
	'Grand Nain,2025-03-08,12,pim@example.test,18.50,Marrowby Quay Saturday Market',
	'ice-cream,2025-03-15,26,,24.00,'
].join('\r\n') + '\r\n';

const blank = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);
const ageMessage = `Enter the age at sale in whole weeks from 0 to ${AGE_MAX_WEEKS}`;

/** One row as csv-parse reads it (strings keyed by header). Blank e-mail and market are allowed: a gate sale without an address. */
export const pastSaleRowSchema = z.object({
	cultivar: lineField({ required: 'Give the cultivar, by name or slug', max: 80, tooLong: 'A cultivar name has at most 80 characters' }),
	'sale date': isoDateField,
	'age at sale (weeks)': z.preprocess(
		(v) => (typeof v === 'string' && /^\s*\d+\s*$/.test(v) ? Number(v) : blank(v)),
		z.number({ error: ageMessage }).int(ageMessage).min(0, ageMessage).max(AGE_MAX_WEEKS, ageMessage)
	),
	'buyer e-mail': z.preprocess(blank, emailField.optional()),
	price: priceField,
	market: z.preprocess(blank, lineField({ required: 'Name the market', max: STOCK_LIMITS.placeMax, tooLong: `A market name has at most ${STOCK_LIMITS.placeMax} characters` }).optional())
});
export type PastSaleRow = z.infer<typeof pastSaleRowSchema>;

export interface ImportIssue {
	/** [row number as the spreadsheet counts it (the header is row 1), column] or [] for the file. */
	path: (string | number)[];
	message: string;
}
