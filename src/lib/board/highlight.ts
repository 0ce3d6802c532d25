/**
 * ts_headline marks matches with two control characters that cannot occur in stored text (the
 * Markdown pipeline's plain text has none), so the snippet is split into plain pieces and hits
 * and rendered as text: no HTML from the database ever reaches the page.
 */
export const HIT_START = '\u0002';
export const HIT_END = '\u0003';

export interface SnippetPiece {
	text: string;
	hit: boolean;
}

export function snippetPieces(headline: string): SnippetPiece[] {
	const pieces: SnippetPiece[] = [];
	for (const [i, part] of headline.split(HIT_START).entries()) {
		if (i === 0) {
			if (part) pieces.push({ text: part, hit: false });
			continue;
		}
		const end = part.indexOf(HIT_END);
		const hit = end === -1 ? part : part.slice(0, end);
		const rest = end === -1 ? '' : part.slice(end + 1);
		if (hit) pieces.push({ text: hit, hit: true });
		if (rest) pieces.push({ text: rest, hit: false });
	}
	return pieces.map((p) => ({ ...p, text: p.text.replace(/[\u0000-\u0008\u000b-\u001f]/g, '') }));
}
