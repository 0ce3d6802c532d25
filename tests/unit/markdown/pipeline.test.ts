import { Parser } from 'htmlparser2';
import { describe, expect, it } from 'vitest';
import { markdownToText, renderMarkdown } from '../../../src/lib/server/markdown';
import { HOSTILE_MARKDOWN } from '../../fixtures/hostile-markdown';

interface Element {
	tag: string;
	attribs: Record<string, string>;
}

/** Every element of the HTML, as a browser-grade tokenizer (htmlparser2, the one sanitize-html uses) reads it. */
function elements(html: string): Element[] {
	const out: Element[] = [];
	const parser = new Parser({ onopentag: (tag, attribs) => out.push({ tag, attribs }) }, { decodeEntities: true });
	parser.write(html);
	parser.end();
	return out;
}

const ALLOWED = new Set(['p', 'br', 'hr', 'h2', 'h3', 'h4', 'h5', 'h6', 'strong', 'em', 'del', 'code', 'pre', 'blockquote', 'ul', 'ol', 'li', 'a', 'img', 'table', 'thead', 'tbody', 'tr', 'th', 'td']);

describe('every hostile input renders harmlessly', () => {
	for (const { name, markdown } of HOSTILE_MARKDOWN) {
		it(name, () => {
			const html = renderMarkdown(markdown);
			for (const el of elements(html)) {
				expect(ALLOWED, `<${el.tag}> in ${html}`).toContain(el.tag);
				for (const [attr, value] of Object.entries(el.attribs)) {
					expect(attr, html).not.toMatch(/^on/i);
					expect(attr, html).not.toBe('style');
					if (attr === 'href' || attr === 'src') {
						expect(value.replace(/[\s\u0000-\u001f]/g, ''), html).not.toMatch(/^(javascript|vbscript|data):/i);
					}
					if (attr === 'src') expect(value, html).toMatch(/^\/uploads\//);
				}
			}
		});
	}
});

describe('ordinary Markdown survives', () => {
	it('keeps emphasis, lists, links and site images', () => {
		const html = renderMarkdown('Cut the **flag leaf** last.\n\n- one\n- two\n\n[more](https://example.test/x) ![bunch](/uploads/ab12.jpg)');
		expect(elements(html).map((e) => e.tag)).toEqual(['p', 'strong', 'ul', 'li', 'li', 'p', 'a', 'img']);
		expect(html).toContain('href="https://example.test/x"');
		expect(html).toContain('rel="nofollow noopener noreferrer"');
		expect(html).toContain('src="/uploads/ab12.jpg"');
	});
	it('starts headings below the page title', () => {
		expect(elements(renderMarkdown('# A\n\n## B')).map((e) => e.tag)).toEqual(['h2', 'h3']);
	});
	it('shows typed HTML as text', () => {
		expect(renderMarkdown('a <b>bold</b> claim')).toBe('<p>a &lt;b&gt;bold&lt;/b&gt; claim</p>\n');
	});
	it('gives plain text for search', () => {
		expect(markdownToText('# Feeding\n\nGive **one handful** & water <in>.')).toBe('Feeding Give one handful & water <in>.');
	});
});
