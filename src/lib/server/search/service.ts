/**
 * One search box across the built-in guides, the nursery's published guides and the question
 * board: PostgreSQL full-text search (websearch_to_tsquery, so people can type "quotes", or and
 * -minus), ranked with ts_rank_cd over generated, GIN-indexed tsvector columns, snippets from
 * ts_headline, results grouped by kind. Staff also find private and hidden questions.
 */
import { sql } from 'drizzle-orm';
import { HIT_END, HIT_START, snippetPieces, type SnippetPiece } from '../../board/highlight';
import type { QuestionState } from '../../board/vocabulary';
import type { AuthUser } from '../auth';
import { db } from '../db';
import { libraryTexts } from '../guides/library-text';

const HEADLINE = `StartSel=${HIT_START}, StopSel=${HIT_END}, MaxWords=30, MinWords=12, MaxFragments=2, FragmentDelimiter=" … "`;
export const RESULTS_PER_KIND = 20;

export interface GuideHit {
	slug: string;
	title: string;
	snippet: SnippetPiece[];
	origin: 'built-in' | 'nursery';
}
export interface QuestionHit {
	id: number;
	title: string;
	state: QuestionState;
	isPublic: boolean;
	snippet: SnippetPiece[];
}

const isStaff = (viewer: Pick<AuthUser, 'role'> | null) => viewer?.role === 'owner' || viewer?.role === 'staff';

/**
 * The questions query on its own, so the scale test can EXPLAIN exactly what the page runs.
 * Matches in a question or in any of its posts count; the best rank of the two wins.
 */
export function questionSearchSql(text: string, staff: boolean, limit: number, offset = 0) {
	const visible = staff ? sql`true` : sql`q.is_public and q.state in ('answered', 'resolved')`;
	return sql`
		with query as (select websearch_to_tsquery('english', ${text}) as tsq),
		hits as (
			select q.id, ts_rank_cd(q.search, query.tsq) as rank
			from questions q, query where q.search @@ query.tsq and ${visible}
			union all
			select p.question_id, ts_rank_cd(p.search, query.tsq) * 0.8
			from question_posts p join questions q on q.id = p.question_id, query
			where p.search @@ query.tsq and ${visible}
		),
		best as (select id, max(rank) as rank from hits group by id order by max(rank) desc, id limit ${limit} offset ${offset})
		select q.id, q.title, q.state, q.is_public as "isPublic", best.rank,
			ts_headline('english', q.title || ' — ' || q.body_text || coalesce(' — ' || (select string_agg(p.body_text, ' — ' order by p.id) from question_posts p where p.question_id = q.id), ''), query.tsq, ${HEADLINE}) as headline
		from best join questions q on q.id = best.id, query
		order by best.rank desc, q.id`;
}

export const searchService = {
	async search(text: string, viewer: Pick<AuthUser, 'role'> | null, page = 1) {
		const staff = isStaff(viewer);
		const library = libraryTexts();
		const [builtIn, nursery, questions] = await Promise.all([
			db.execute<{ slug: string; title: string; rank: number; headline: string }>(sql`
				with query as (select websearch_to_tsquery('english', ${text}) as tsq),
				docs as (select * from jsonb_to_recordset(${JSON.stringify(library)}::jsonb) as g(slug text, title text, summary text, body text))
				select d.slug, d.title, ts_rank_cd(v.doc, query.tsq) as rank, ts_headline('english', d.summary || ' ' || d.body, query.tsq, ${HEADLINE}) as headline
				from docs d, query,
					lateral (select setweight(to_tsvector('english', d.title), 'A') || setweight(to_tsvector('english', d.summary), 'B') || setweight(to_tsvector('english', d.body), 'C') as doc) v
				where v.doc @@ query.tsq
					and not exists (select 1 from guides g where g.replaces = d.slug and g.status = 'published')
				order by rank desc`),
			db.execute<{ slug: string; title: string; rank: number; headline: string }>(sql`
				with query as (select websearch_to_tsquery('english', ${text}) as tsq)
				select g.slug, g.title, ts_rank_cd(g.search, query.tsq) as rank, ts_headline('english', g.summary || ' ' || g.body_text, query.tsq, ${HEADLINE}) as headline
				from guides g, query
				where g.status = 'published' and g.search @@ query.tsq
				order by rank desc limit ${RESULTS_PER_KIND}`),
			db.execute<{ id: number; title: string; state: QuestionState; isPublic: boolean; rank: number; headline: string }>(
				questionSearchSql(text, staff, RESULTS_PER_KIND + 1, (page - 1) * RESULTS_PER_KIND)
			)
		]);
		const guides: GuideHit[] = [
			...[...nursery].map((g) => ({ ...g, origin: 'nursery' as const })),
			...[...builtIn].map((g) => ({ ...g, origin: 'built-in' as const }))
		]
			.sort((a, b) => Number(b.rank) - Number(a.rank))
			.slice(0, RESULTS_PER_KIND)
			.map((g) => ({ slug: g.slug, title: g.title, origin: g.origin, snippet: snippetPieces(g.headline) }));
		const rows = [...questions];
		return {
			guides,
			questions: rows.slice(0, RESULTS_PER_KIND).map((q) => ({ id: q.id, title: q.title, state: q.state, isPublic: q.isPublic, snippet: snippetPieces(q.headline) })) as QuestionHit[],
			moreQuestions: rows.length > RESULTS_PER_KIND,
			includesPrivate: staff
		};
	}
};
