import { expect, test } from '@playwright/test';
import { makeUser, open, signInWithPassword } from './support';

test.use({ viewport: { width: 390, height: 844 } });

test('side by side on a phone: scrolled sideways, the field names stay readable above the values', async ({
	page
}) => {
	await page.goto('/builds?view=table&q=one+change');
	const ids = await page
		.getByRole('link', { name: /./ })
		.evaluateAll((as) =>
			[
				...new Set(
					as
						.map((a) => (a as HTMLAnchorElement).pathname.match(/^\/builds\/(\d+)$/)?.[1])
						.filter(Boolean)
				)
			].slice(0, 4)
		);
	expect(ids.length).toBeGreaterThanOrEqual(3);
	await page.goto(`/side-by-side?${ids.map((id) => `builds=${id}`).join('&')}`);
	const scroller = page.getByRole('table').locator('xpath=..');
	await scroller.evaluate((el) => (el.scrollLeft = 120));
	// Every sticky row heading: opaque, and on top where it sits.
	const covered = await page.getByRole('table').evaluate((table) => {
		const bad: string[] = [];
		for (const th of table.querySelectorAll('tbody th[scope="row"]')) {
			const bg = getComputedStyle(th).backgroundColor;
			const alpha = bg.startsWith('rgba') ? Number(bg.split(',')[3].replace(')', '')) : 1;
			if (bg === 'transparent' || alpha < 1) bad.push(`${th.textContent} see-through (${bg})`);
			const r = th.getBoundingClientRect();
			const top = document.elementFromPoint(r.left + 4, r.top + r.height / 2);
			if (r.height && top && top !== th && !th.contains(top))
				bad.push(`${th.textContent} covered by ${top.textContent}`);
		}
		return bad;
	});
	expect(covered).toEqual([]);
});

test('a build page on a phone: wide tables scroll from the keyboard, columns keep apart, empty figures fold away', async ({
	page
}) => {
	await page.goto('/builds?sort=fastest');
	const href = await page
		.getByRole('article')
		.first()
		.getByRole('link')
		.first()
		.getAttribute('href');
	await page.goto(href!);
	for (const d of await page.locator('main details').all())
		await d.evaluate((e) => e.setAttribute('open', ''));
	const report = await page.locator('main').evaluate((main) => {
		const out = { unreachable: [] as string[], tight: [] as string[], monoHeads: [] as string[] };
		for (const el of main.querySelectorAll<HTMLElement>('*')) {
			const o = getComputedStyle(el).overflowX;
			if ((o === 'auto' || o === 'scroll') && el.scrollWidth > el.clientWidth + 1) {
				// What the scrollable-region-focusable check asks: the box, or something in it, takes focus.
				const focusable =
					el.tabIndex >= 0 || el.querySelector('a, button, input, select, [tabindex]');
				if (!focusable) out.unreachable.push(el.outerHTML.slice(0, 80));
			}
		}
		for (const row of main.querySelectorAll('tr')) {
			const cells = [...row.children] as HTMLElement[];
			for (let i = 1; i < cells.length; i++) {
				const gap =
					parseFloat(getComputedStyle(cells[i - 1]).paddingRight) +
					parseFloat(getComputedStyle(cells[i]).paddingLeft);
				if (gap < 6) out.tight.push(`${cells[i - 1].textContent}|${cells[i].textContent}`);
			}
		}
		for (const th of main.querySelectorAll('thead th'))
			if (/mono/i.test(getComputedStyle(th).fontFamily)) out.monoHeads.push(th.textContent ?? '');
		return out;
	});
	expect(report.unreachable).toEqual([]);
	expect(report.tight.slice(0, 5)).toEqual([]);
	expect(report.monoHeads).toEqual([]);
	// Worked-out figures: only those with a value are rows; the rest say what they need.
	const worked = page.getByRole('table', { name: 'Worked out from this setup' }).first();
	await expect(worked.getByRole('cell', { name: '—', exact: true })).toHaveCount(0);
	// Methods in words everywhere, the printed sheet (hidden on screen) included.
	expect(await page.locator('main').textContent()).not.toMatch(/phone-gps|gps-logger/);
});

/** Controls smaller than 24 × 24 px (WCAG 2.2, 2.5.8); links inside running text are exempt. */
async function smallTargets(page: import('@playwright/test').Page) {
	return page.evaluate(() => {
		const out: string[] = [];
		const sel =
			'button, select, input:not([type="hidden"]), summary, nav a, header a, td a, .btn, .btn-quiet';
		for (const el of document.querySelectorAll<HTMLElement>(sel)) {
			const r = el.getBoundingClientRect();
			if (!r.width || !r.height || getComputedStyle(el).visibility === 'hidden') continue;
			if (el.closest('.sr-only, [aria-hidden="true"], .print\\:block, [hidden]')) continue;
			// A link in a cell beside other words reads as text; a cell that is just the link is a target.
			if (
				el.tagName === 'A' &&
				el.closest('td') &&
				el.closest('td')!.textContent!.trim() !== el.textContent!.trim()
			)
				continue;
			if (r.height < 23.5 || r.width < 23.5)
				out.push(
					`${el.tagName.toLowerCase()} "${(el.textContent || el.getAttribute('aria-label') || '').trim().slice(0, 30)}" ${Math.round(r.width)}×${Math.round(r.height)}`
				);
		}
		return out;
	});
}

test('on a phone the header stays short, its mark is not a menu button, and controls are big enough to hit', async ({
	page
}) => {
	const u = await makeUser();
	await signInWithPassword(page, u.email, u.password);
	await open(page, '/builds?view=table');
	const header = await page.getByRole('banner').boundingBox();
	expect(header!.height).toBeLessThan(120);
	expect(await smallTargets(page)).toEqual([]);
	const href = await page
		.getByRole('link', { name: /./ })
		.evaluateAll((as) =>
			as.map((a) => (a as HTMLAnchorElement).pathname).find((p) => /^\/builds\/\d+$/.test(p))
		);
	await open(page, href!);
	expect(await smallTargets(page)).toEqual([]);
	await open(page, '/builds/new');
	expect(await smallTargets(page)).toEqual([]);
	// Wide tables of the desk and the admin pages scroll inside their box, not the whole page.
	const admin = await makeUser({ role: 'admin' });
	const ctx = await page
		.context()
		.browser()!
		.newContext({ viewport: { width: 390, height: 844 } });
	const a = await ctx.newPage();
	await signInWithPassword(a, admin.email, admin.password);
	for (const path of ['/admin', '/review/log', '/admin/shops']) {
		await open(a, path);
		const wide = await a.evaluate(() => document.documentElement.scrollWidth);
		expect(wide, path).toBeLessThanOrEqual(390);
	}
	await ctx.close();
});
