/**
 * Import of past sales from a spreadsheet (a nursery moving to Bunchline): every row is checked,
 * every problem is reported with its row number and column, and nothing is written unless every
 * row is good; then all of them are written in one transaction, each as a sale of one plant with
 * its own claim code (the stall's rule, `insertSoldPlants`).
 */
import { randomUUID } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import { sql } from 'drizzle-orm';
import { IMPORT_MAX_ROWS, PAST_SALE_COLUMNS, pastSaleRowSchema, type ImportIssue, type PastSaleRow } from '../../schema/past-sales';
import { toCents } from '../../schema/stock';
import { ApiInputError } from '../api';
import { cultivars, marketDays, sales } from '../db/schema';
import { insertSoldPlants } from '../sales/service';
import type { AnyDb } from '../secrets';

export interface PastSalesDeps {
	db: AnyDb;
	secret: () => Promise<string>;
	today: () => Promise<string>;
}

/** Rows of text keyed by header; a file that is not CSV at all is one issue naming the line. */
function readCsv(text: string): Record<string, string>[] {
	try {
		return parse(text, { bom: true, columns: (header: string[]) => header.map((h) => h.trim().toLowerCase()), skip_empty_lines: true, trim: true });
	} catch (e) {
		const line = (e as { lines?: number }).lines;
		throw new ApiInputError('Nothing was imported: the file is not readable as CSV', [
			{ path: line ? [line] : [], message: `Not valid CSV${line ? ` at row ${line}` : ''}: ${(e as Error).message.replace(/^Invalid [^:]*:\s*/, '')}` }
		]);
	}
}

export function makePastSalesImport({ db, secret, today }: PastSalesDeps) {
	return {
		/** Checks every row; writes all of them or none. Resolves the number of sales written. */
		async run(text: string, sellerId: number | null): Promise<{ imported: number }> {
			const records = readCsv(text);
			const header = records.length > 0 ? Object.keys(records[0]) : (text.split(/\r?\n/)[0] ?? '').split(',').map((h) => h.trim().toLowerCase());
			const missing = PAST_SALE_COLUMNS.filter((c) => !header.includes(c));
			if (missing.length) {
				throw new ApiInputError('Nothing was imported: the header row is missing columns', missing.map((c) => ({ path: [1, c], message: `Add the column "${c}" (download the template for the exact header)` })));
			}
			if (records.length === 0) throw new ApiInputError('Nothing was imported: the file has no rows under the header', [{ path: [], message: 'Add at least one sale under the header row' }]);
			if (records.length > IMPORT_MAX_ROWS) {
				throw new ApiInputError('Nothing was imported: too many rows', [{ path: [], message: `At most ${IMPORT_MAX_ROWS.toLocaleString('en')} rows per file: split it in two` }]);
			}

			const day = await today();
			const known = await db.select({ id: cultivars.id, slug: cultivars.slug, name: cultivars.name }).from(cultivars);
			const byKey = new Map(known.flatMap((c) => [[c.slug, c.id], [c.name.toLowerCase(), c.id]] as const));
			const issues: ImportIssue[] = [];
			const rows: (PastSaleRow & { cultivarId: number })[] = [];
			records.forEach((record, i) => {
				const rowNumber = i + 2;
				const parsed = pastSaleRowSchema.safeParse(record);
				if (!parsed.success) {
					for (const issue of parsed.error.issues) issues.push({ path: [rowNumber, ...issue.path.map(String)], message: issue.message });
					return;
				}
				const cultivarId = byKey.get(parsed.data.cultivar.toLowerCase());
				if (cultivarId === undefined) issues.push({ path: [rowNumber, 'cultivar'], message: `Unknown cultivar "${parsed.data.cultivar}": use a name or slug from the catalogue` });
				else if (parsed.data['sale date'] > day) issues.push({ path: [rowNumber, 'sale date'], message: 'A past sale cannot be dated after today' });
				else rows.push({ ...parsed.data, cultivarId });
			});
			if (issues.length) {
				const bad = new Set(issues.map((i) => i.path[0])).size;
				throw new ApiInputError(`Nothing was imported: ${bad} ${bad === 1 ? 'row has' : 'rows have'} errors`, issues);
			}

			const key = await secret();
			await db.transaction(async (tx) => {
				const dayIds = new Map<string, number>();
				for (const row of rows) {
					let marketDayId: number | null = null;
					if (row.market) {
						const k = `${row['sale date']}|${row.market}`;
						if (!dayIds.has(k)) {
							const [m] = await tx
								.insert(marketDays)
								.values({ on: row['sale date'], place: row.market })
								.onConflictDoUpdate({ target: [marketDays.on, marketDays.place], set: { place: sql`excluded.place` } })
								.returning({ id: marketDays.id });
							dayIds.set(k, m.id);
						}
						marketDayId = dayIds.get(k)!;
					}
					const [sale] = await tx
						.insert(sales)
						.values({
							clientId: randomUUID(),
							cultivarId: row.cultivarId,
							marketDayId,
							soldOn: row['sale date'],
							quantity: 1,
							pricePerPlantCents: toCents(row.price),
							buyerEmail: row['buyer e-mail'] ?? null,
							soldBy: sellerId
						})
						.returning({ id: sales.id });
					await insertSoldPlants(tx, key, { saleId: sale.id, cultivarId: row.cultivarId, soldOn: row['sale date'], ageAtSaleWeeks: row['age at sale (weeks)'], quantity: 1 });
				}
			});
			return { imported: rows.length };
		}
	};
}

export type PastSalesImport = ReturnType<typeof makePastSalesImport>;
