/**
 * CSV out: RFC 4180 (comma, double quotes doubled, CRLF line ends, fields with a comma, quote or
 * line break quoted) with csv-stringify, and cells beginning with = + - @ prefixed with ' so a
 * spreadsheet shows them as text instead of running them as formulas (OWASP "CSV Injection").
 */
import { stringify } from 'csv-stringify/sync';

type Cell = string | number;

const OPTIONS = {
	record_delimiter: 'windows',
	escape_formulas: true,
	// csv-stringify quotes the record delimiter (CRLF) but not a lone CR or LF; RFC 4180 readers expect both quoted.
	quoted_match: /[\r\n]/
} as const;

export function csvLines(rows: Cell[][]): string {
	return rows.length === 0 ? '' : stringify(rows, OPTIONS);
}

/** A header, then every batch as it arrives: the response starts at once and holds one batch in memory. */
export function csvStream(header: string[], batches: AsyncIterable<Cell[][]>): ReadableStream<Uint8Array> {
	const encoder = new TextEncoder();
	const iterator = batches[Symbol.asyncIterator]();
	return new ReadableStream<Uint8Array>({
		start(controller) {
			controller.enqueue(encoder.encode(csvLines([header])));
		},
		async pull(controller) {
			const next = await iterator.next();
			if (next.done) controller.close();
			else controller.enqueue(encoder.encode(csvLines(next.value)));
		},
		async cancel() {
			// The client went away: end the cursor so its connection goes back to the pool.
			await iterator.return?.(undefined);
		}
	});
}
