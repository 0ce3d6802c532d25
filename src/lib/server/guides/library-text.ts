/**
 * The built-in guides as plain text for search. Eight files ship with the app, so they are searched
 * with the same PostgreSQL text search as the tables, but from a list passed in with the query
 * rather than from a table of their own.
 */
import { listGuides } from '../../guides';
import { markdownToText } from '../markdown';

const raw = import.meta.glob<string>('/content/guides/*.md', { query: '?raw', import: 'default', eager: true });

export interface LibraryText {
	slug: string;
	title: string;
	summary: string;
	body: string;
}

let cached: LibraryText[] | null = null;

export function libraryTexts(): LibraryText[] {
	cached ??= listGuides().map((g) => {
		const file = Object.entries(raw).find(([path]) => path.endsWith(`/${g.slug}.md`))?.[1] ?? '';
		return { slug: g.slug, title: g.title, summary: g.summary, body: markdownToText(file.replace(/^---\n[\s\S]*?\n---\n/, '')) };
	});
	return cached;
}
