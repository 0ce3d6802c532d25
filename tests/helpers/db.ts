import { sql } from 'drizzle-orm';
import { db } from '../../src/lib/server/db';

/** Row counts of the tables a refused request must not touch. */
export async function tableCounts(): Promise<Record<string, number>> {
	const rows = await db.execute<{ t: string; n: number }>(sql`
		select 'users' as t, count(*)::int as n from users union all
		select 'sessions', count(*)::int from sessions union all
		select 'email_tokens', count(*)::int from email_tokens union all
		select 'invitations', count(*)::int from invitations union all
		select 'guides', count(*)::int from guides union all
		select 'guide_revisions', count(*)::int from guide_revisions union all
		select 'questions', count(*)::int from questions union all
		select 'question_posts', count(*)::int from question_posts`);
	return Object.fromEntries([...rows].map((r) => [r.t, r.n]));
}

let counter = 0;
export const uniqueEmail = (prefix = 'person') => `${prefix}.${process.pid}.${Date.now().toString(36)}.${++counter}@example.test`;
