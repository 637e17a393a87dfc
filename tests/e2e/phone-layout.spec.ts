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
