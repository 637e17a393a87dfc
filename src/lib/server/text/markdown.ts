import { createHash } from 'node:crypto';
import DOMPurify from 'isomorphic-dompurify';
import { marked } from 'marked';
import { env } from '../env';
import { recent } from '../../recent';

// Member-written Markdown (stories, comments, shop pages, the desk's view of them) as HTML that
// can only be text: an allow-list of the elements Markdown itself produces, no `style`, `class`
// or `id` (nothing can be positioned over the page or dressed as the site), no forms, frames or
// embedded documents. Images only from our own object store (the photo routes); any other image
// becomes a plain link. Links are marked as user content and open nothing with our window.

const TAGS = [
	'p', 'br', 'hr', 'h1', 'h2', 'h3', 'h4', 'h5', 'h6', 'strong', 'em', 'del', 's', 'code',
	'pre', 'blockquote', 'ul', 'ol', 'li', 'a', 'img', 'table', 'thead', 'tbody', 'tr', 'th',
	'td', 'sup', 'sub'
]; // prettier-ignore
const ATTRS = ['href', 'title', 'alt', 'src', 'align', 'start'];
const OWN_IMAGE = /^\/api\/photos\/\d+\/[a-z]+$/;

/** A path on this site for one of our stored photos, or null. */
function ownImagePath(src: string): string | null {
	try {
		const origin = env().ORIGIN;
		const url = new URL(src, origin);
		return url.origin === origin && OWN_IMAGE.test(url.pathname) ? url.pathname : null;
	} catch {
		return null;
	}
}

// Sanitising goes through a whole DOM (jsdom) and cost the build page most of its time; the result
// depends on the text alone, so recent results are kept, by a hash of the text.
const rendered = recent<string>(2000);

export function renderMarkdown(source: string): string {
	const key = createHash('sha1')
		.update(source ?? '')
		.digest('base64url');
	return rendered(key, () => sanitise(source));
}

function sanitise(source: string): string {
	const html = marked.parse(source ?? '', { async: false, gfm: true, breaks: false });
	const fragment = DOMPurify.sanitize(html, {
		ALLOWED_TAGS: TAGS,
		ALLOWED_ATTR: ATTRS,
		ALLOW_DATA_ATTR: false,
		ALLOW_ARIA_ATTR: false,
		RETURN_DOM_FRAGMENT: true
	});
	// A document DOMPurify cannot give a body to (a <frameset>, say) is shown as the text it is.
	if (!fragment) return `<p>${escapeText(source ?? '')}</p>`;
	const doc = fragment.ownerDocument;
	for (const img of [...fragment.querySelectorAll('img')]) {
		const own = ownImagePath(img.getAttribute('src') ?? '');
		if (own) {
			img.setAttribute('src', own);
			img.setAttribute('loading', 'lazy');
			continue;
		}
		// Someone else's image would load from their server for every reader: show a link.
		const a = doc.createElement('a');
		const src = img.getAttribute('src');
		if (src) a.setAttribute('href', src);
		a.textContent = img.getAttribute('alt') || src || 'image';
		img.replaceWith(a);
	}
	for (const a of [...fragment.querySelectorAll('a')]) {
		const href = a.getAttribute('href') ?? '';
		if (!/^(https?:|mailto:|\/(?!\/)|#)/i.test(href)) a.removeAttribute('href');
		a.setAttribute('rel', 'ugc nofollow noopener');
	}
	const box = doc.createElement('div');
	box.appendChild(fragment);
	return box.innerHTML;
}

const escapeText = (s: string) =>
	s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`).replace(/\n/g, '<br>');
