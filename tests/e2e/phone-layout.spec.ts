import { expect, test } from '@playwright/test';

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
