import { describe, expect, it } from 'vitest';
import { renderMarkdown } from '../../src/lib/server/text/markdown';

// What member-written Markdown may become. The browser check that nothing covers the page is in
// tests/security/xss.spec.ts; these pin the allow-list itself.
describe('renderMarkdown allow-list', () => {
	it('drops style, class and id: a full-screen overlay is only text', () => {
		const out = renderMarkdown(
			'<div style="position:fixed;inset:0;z-index:9999;background:#fff" class="sheet" id="main">' +
				'<h1>Your session expired</h1><p>Sign in again</p></div>'
		);
		expect(out).not.toMatch(/style=|class=|id=|<div/);
		expect(out).toContain('Your session expired');
	});

	it('removes forms, inputs, buttons, iframes, objects and SVG', () => {
		const out = renderMarkdown(
			'<form action="https://evil.example"><input name="password"><button>Go</button></form>' +
				'<iframe src="https://evil.example"></iframe><object data="x"></object>' +
				'<svg><circle r="9"/></svg><math><mi>x</mi></math>'
		);
		expect(out).not.toMatch(/<(form|input|button|iframe|object|svg|math)/);
	});

	it('shows a frameset document as text rather than failing the page', () => {
		const out = renderMarkdown('<frameset onload=alert(1)>');
		expect(out).toBe('<p>&#60;frameset onload=alert(1)&#62;</p>');
	});

	it('marks links as user content and drops script URLs', () => {
		const out = renderMarkdown('[pipe notes](https://example.org/a) [x](javascript:alert(1))');
		expect(out).toContain('href="https://example.org/a"');
		expect(out).toContain('rel="ugc nofollow noopener"');
		expect(out).not.toContain('javascript:');
	});

	it('keeps images from our own photo routes and turns others into links', () => {
		const own = renderMarkdown('![head](/api/photos/12/large)');
		expect(own).toMatch(/<img[^>]+src="\/api\/photos\/12\/large"/);
		const other = renderMarkdown('![track map](https://tracker.example/pixel.png)');
		expect(other).not.toContain('<img');
		expect(other).toContain('<a href="https://tracker.example/pixel.png"');
		expect(other).toContain('track map');
	});

	it('keeps what Markdown is for: emphasis, lists, code, quotes and tables', () => {
		const out = renderMarkdown(
			'**rich** _lean_\n\n- 98 main\n- clip 3\n\n`squish 0.9 mm`\n\n> plug tan\n\n| a | b |\n|---|---|\n| 1 | 2 |'
		);
		for (const tag of ['<strong>', '<em>', '<li>', '<code>', '<blockquote>', '<table>'])
			expect(out).toContain(tag);
	});
});
