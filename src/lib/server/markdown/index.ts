/**
 * The one Markdown pipeline for everything people type in the browser (owner's guides, questions,
 * answers, replies): marked turns Markdown into HTML, then sanitize-html keeps only a short list of
 * tags and attributes. Raw HTML in the Markdown is shown as text, never interpreted; the sanitizer
 * is the second wall in case marked ever emits something it should not.
 *
 * Why these two: both are well-known registry packages that run on Node 20 without native code
 * (shared/STACK.md), and sanitize-html works on strings on the server, so the preview shown while
 * typing and the stored HTML come from the same code.
 */
import { Marked, type Tokens } from 'marked';
import sanitizeHtml from 'sanitize-html';

const escapeHtml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

const marked = new Marked({
	gfm: true,
	async: false,
	// The page already has its own h1 (the title): text headings start one level down.
	walkTokens(token) {
		if (token.type === 'heading') (token as Tokens.Heading).depth = Math.min((token as Tokens.Heading).depth + 1, 6);
	},
	renderer: {
		// Typed HTML is text, not markup.
		html(token: Tokens.HTML | Tokens.Tag) {
			return escapeHtml(token.text);
		}
	}
});

/** Where images in typed text may come from: this site's own uploads, nothing else (no tracking pixels, no data: URLs). */
export const IMAGE_PATH = /^\/uploads\/[A-Za-z0-9._\-/]+$/;

const SANITIZE: sanitizeHtml.IOptions = {
	allowedTags: [
		'p', 'br', 'hr', 'h2', 'h3', 'h4', 'h5', 'h6', 'strong', 'em', 'del', 'code', 'pre', 'blockquote',
		'ul', 'ol', 'li', 'a', 'img', 'table', 'thead', 'tbody', 'tr', 'th', 'td'
	],
	allowedAttributes: { a: ['href', 'title'], img: ['src', 'alt', 'title'], ol: ['start'], th: ['align'], td: ['align'] },
	allowedSchemes: ['http', 'https', 'mailto'],
	allowedSchemesByTag: { img: [] },
	allowProtocolRelative: false,
	disallowedTagsMode: 'escape',
	transformTags: {
		a: (tagName, attribs) => ({
			tagName,
			attribs: { ...attribs, rel: 'nofollow noopener noreferrer' }
		})
	},
	exclusiveFilter: (frame) => frame.tag === 'img' && !IMAGE_PATH.test(frame.attribs.src ?? '')
};
// `rel` is added by the transform above; it must survive the attribute filter that runs after it.
(SANITIZE.allowedAttributes as Record<string, string[]>).a.push('rel');

/** Markdown typed by a person → HTML safe to put in a page with {@html}. */
export function renderMarkdown(markdown: string): string {
	const html = marked.parse(markdown) as string;
	return sanitizeHtml(html, SANITIZE);
}

/** Plain text of a Markdown body, for search and summaries. */
export function markdownToText(markdown: string): string {
	return sanitizeHtml(renderMarkdown(markdown), { allowedTags: [], allowedAttributes: {} })
		.replace(/&amp;/g, '&')
		.replace(/&lt;/g, '<')
		.replace(/&gt;/g, '>')
		.replace(/&quot;/g, '"')
		.replace(/&#39;/g, "'")
		.replace(/\s+/g, ' ')
		.trim();
}
