// The question search at scale: 50,000 questions, ANALYZE, then EXPLAIN the exact query the page
// runs and check it goes through the GIN index. Timings are printed for bench/RESULTS.md, never asserted.
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../../src/lib/server/db';
import { questionSearchSql } from '../../../src/lib/server/search/service';
import { person } from '../../helpers/people';

const COUNT = 50_000;
let askerId = 0;

beforeAll(async () => {
	askerId = (await person('gardener')).id;
	// Varied text from a small trade vocabulary, plus one rare word per question.
	await db.execute(sql`
		insert into questions (asker_id, title, body, body_html, body_text, is_public, state, answered_at)
		select ${askerId},
			'Question ' || i || ' about ' || (array['leaves','stem','bunch','follower','roots','frost','wind','feeding','fingers','flower'])[1 + i % 10],
			b, b, b, i % 3 = 0, (array['waiting','answered','resolved'])[1 + i % 3]::question_state, now()
		from generate_series(1, ${COUNT}) as i,
			lateral (select 'My plant shows ' || (array['yellow edges','brown spots','split stems','slow growth','torn leaves'])[1 + i % 5]
				|| ' after ' || (array['rain','a cold night','feeding','transplanting','strong wind'])[1 + (i / 5) % 5]
				|| '. Marker scalemark' || i || '.' as b) t`);
	await db.execute(sql`analyze questions`);
	await db.execute(sql`analyze question_posts`);
}, 300_000);

afterAll(async () => {
	await db.execute(sql`delete from questions where asker_id = ${askerId}`);
});

async function plan(text: string, staff: boolean): Promise<string> {
	const rows = await db.execute<{ 'QUERY PLAN': string }>(sql`explain ${questionSearchSql(text, staff, 21)}`);
	return [...rows].map((r) => r['QUERY PLAN']).join('\n');
}

async function timed(text: string, staff: boolean): Promise<number> {
	await db.execute(questionSearchSql(text, staff, 21)); // warm
	const runs: number[] = [];
	for (let i = 0; i < 5; i++) {
		const t = performance.now();
		await db.execute(questionSearchSql(text, staff, 21));
		runs.push(performance.now() - t);
	}
	return runs.sort((a, b) => a - b)[2];
}

describe(`question search over ${COUNT.toLocaleString('en')} questions`, () => {
	it('has them all', async () => {
		const [{ n }] = await db.execute<{ n: number }>(sql`select count(*)::int as n from questions where asker_id = ${askerId}`);
		expect(n).toBe(COUNT);
	});
	for (const [label, text, staff] of [
		['a rare word, public', 'scalemark31337', false],
		['a rare word, staff', 'scalemark31337', true],
		['two common words, staff', 'cold frost', true],
		['a phrase, public', '"brown spots" wind', false]
	] as const) {
		it(`${label} goes through the GIN index`, async () => {
			const p = await plan(text, staff);
			expect(p).toMatch(/Bitmap Index Scan on questions_search_idx/);
			const ms = await timed(text, staff);
			console.log(`search-scale: ${label} (${JSON.stringify(text)}): median of 5 = ${ms.toFixed(1)} ms`);
		});
	}
});
