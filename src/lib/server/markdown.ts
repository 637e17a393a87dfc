import DOMPurify from 'isomorphic-dompurify';
import { marked } from 'marked';

/** Member-written Markdown as safe HTML: rendered by marked, then stripped of anything that runs. */
export function renderMarkdown(source: string): string {
	const html = marked.parse(source ?? '', { async: false, gfm: true, breaks: false });
	return DOMPurify.sanitize(html, {
		USE_PROFILES: { html: true },
		FORBID_TAGS: ['style', 'form', 'input', 'button']
	});
}
