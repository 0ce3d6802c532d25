import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { ageInWeeks, isOverdue, kindLabel } from '$lib/plant-table';
import { exportSearch, parsePlantTableQuery, plantTableSearch, TABLE_ROW_LIMIT } from '$lib/schema/plant-table';
import { csvLines } from '$lib/server/csv';

describe('a plant in the table', () => {
	it('is as old as at its sale plus the whole weeks since', () => {
		expect(ageInWeeks('2026-03-07', 12, '2026-03-07')).toBe(12);
		expect(ageInWeeks('2026-03-07', 12, '2026-03-13')).toBe(12);
		expect(ageInWeeks('2026-03-07', 12, '2026-03-14')).toBe(13);
		// Across a leap day: 2028-02-01 to 2028-03-01 is 29 days, four whole weeks.
		expect(ageInWeeks('2028-02-01', 0, '2028-03-01')).toBe(4);
		expect(ageInWeeks('2026-03-07', 12, '2026-01-01')).toBe(12);
	});
	it('is overdue only once the next step day has passed', () => {
		expect(isOverdue('2026-03-06', '2026-03-07')).toBe(true);
		expect(isOverdue('2026-03-07', '2026-03-07')).toBe(false);
		expect(isOverdue(null, '2026-03-07')).toBe(false);
	});
	it('reads step kinds as words', () => expect(kindLabel('flag-leaf')).toBe('Flag leaf'));
});

describe('the table query', () => {
	it('fills defaults and treats empty fields as "any"', () => {
		const r = parsePlantTableQuery(new URLSearchParams('cultivar=&stage=&page=&perPage='));
		expect(r.success && r.data).toEqual({ sort: 'nextStep', order: 'asc', page: 1, perPage: 25 });
	});
	it('names every bad field', () => {
		const r = parsePlantTableQuery(new URLSearchParams('stage=ripe&market=x&perPage=500&page=0&cultivar=Grand%20Nain'));
		expect(r.success).toBe(false);
		expect(r.error!.issues.map((i) => i.path.join('.')).sort()).toEqual(['cultivar', 'market', 'page', 'perPage', 'stage']);
	});
	it('refuses a page beyond the first rows it pages through', () => {
		expect(parsePlantTableQuery(new URLSearchParams(`page=${TABLE_ROW_LIMIT / 100}&perPage=100`)).success).toBe(true);
		expect(parsePlantTableQuery(new URLSearchParams(`page=${TABLE_ROW_LIMIT / 100 + 1}&perPage=100`)).success).toBe(false);
	});
	it('writes the shortest URL for a view, defaults left out, and it parses back', () => {
		const search = plantTableSearch({ perPage: '25', sort: 'nextStep', page: 3, stage: 'growing-leaves', cultivar: 'grand-nain', overdue: '' });
		expect(search).toBe('?cultivar=grand-nain&stage=growing-leaves&page=3');
		const r = parsePlantTableQuery(new URLSearchParams(search));
		expect(r.success && r.data).toMatchObject({ cultivar: 'grand-nain', stage: 'growing-leaves', page: 3 });
		expect(plantTableSearch({})).toBe('');
		expect(exportSearch({ stage: 'growing-leaves', page: 3, perPage: 50, order: 'desc' })).toBe('?stage=growing-leaves&order=desc');
	});
});

describe('CSV out', () => {
	it('quotes per RFC 4180 and reads back the same cells (csv-parse as the reference reader)', () => {
		const cells = [['a,b', 'say "hi"', 'two\nlines', 'cr\ronly', 42, '']];
		const text = csvLines(cells);
		expect(text).toBe('"a,b","say ""hi""","two\nlines","cr\ronly",42,\r\n');
		expect(parse(text)).toEqual([['a,b', 'say "hi"', 'two\nlines', 'cr\ronly', '42', '']]);
	});
	it('keeps spreadsheet formulas from running (OWASP CSV Injection): = + - @ get a leading quote', () => {
		expect(parse(csvLines([['=SUM(A1)', '+1', '-2', '@cmd', 'safe', -3]]))).toEqual([["'=SUM(A1)", "'+1", "'-2", "'@cmd", 'safe', '-3']]);
	});
});
