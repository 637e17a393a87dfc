import { expect, test } from '@playwright/test';
import { open } from './support';

// An anonymous newcomer asking the published sheets "what works?" (demo data: invented, fixed seed).

test('the speed map narrows to GPS runs and expansion chambers, and its points change', async ({
	page
}) => {
	await page.goto('/speed-map?x=final-drive');
	await page.waitForLoadState('networkidle');
	const count = page.getByTestId('map-count');
	const before = Number((await count.innerText()).replace(/,/g, ''));
	expect(before).toBeGreaterThan(0);
	await expect(page.locator('.speed-map-chart svg').first()).toBeVisible();

	const settings = page.getByRole('form', { name: 'Speed map settings' });
	await settings.getByLabel('GPS logger').check();
	await settings.getByLabel('expansion chamber').check();
	await expect(page).toHaveURL(/method=gps-logger/);
	await expect(page).toHaveURL(/pipe=expansion-chamber/);
	await expect
		.poll(async () => Number((await count.innerText()).replace(/,/g, '')))
		.toBeLessThan(before);

	// The table view carries the same points: every one an expansion chamber now.
	await page.getByText('The same data as a table').click();
	const rows = page.getByRole('table').getByRole('row');
	await expect(rows.nth(1)).toBeVisible();
	const exhausts = await rows.locator('td:nth-child(3)').allInnerTexts();
	expect(exhausts.length).toBeGreaterThan(0);
	expect(new Set(exhausts)).toEqual(new Set(['expansion chamber']));

	// The state is in the address: reloading shows the same filtered map (other tests may publish
	// meanwhile, so the settings are compared, not the exact count).
	await page.reload();
	await expect(settings.getByLabel('GPS logger')).toBeChecked();
	await expect(settings.getByLabel('expansion chamber')).toBeChecked();
	await expect(settings.getByLabel('radar')).not.toBeChecked();
});

test('the speed map keeps marks off its axes, and draws no line across two clusters', async ({
	page
}) => {
	await page.goto('/speed-map?x=displacement');
	const svg = page.locator('.speed-map-chart svg:has([aria-label="dot"])');
	await expect(svg).toBeVisible();
	const gap = await svg.evaluate((el) => {
		// The y axis is drawn where the x scale starts; every mark must sit to its right.
		const axisX = Math.min(
			...[...el.querySelectorAll('[aria-label="y-axis tick"] path')].map(
				(p) => p.getBoundingClientRect().right
			)
		);
		const marks = [...el.querySelectorAll('[aria-label="dot"] path, [aria-label="dot"] circle')];
		const left = Math.min(...marks.map((m) => m.getBoundingClientRect().left));
		return { left, axisX, marks: marks.length };
	});
	expect(gap.marks).toBeGreaterThan(0);
	expect(gap.left).toBeGreaterThan(gap.axisX + 4);
	await expect(page.getByText(/No trend line: the builds/)).toBeVisible();
	await expect(page.getByText(/Trend \(least squares/)).toHaveCount(0);
});

test('change effects tells what a final-drive change did, with the pairs behind it', async ({
	page
}) => {
	await page.goto('/change-effects');
	await expect(page.getByRole('heading', { name: 'Which steps count' })).toBeVisible();
	const row = page.getByRole('row', { name: /Final-drive gears/ });
	await expect(row).toContainText(/\+\d+\.\d\skm\/h/); // a median gain, sign spelled out
	await row.getByRole('link', { name: 'Final-drive gears' }).click();
	await expect(page).toHaveURL(/kind=final-drive/);
	await expect(
		page.getByRole('heading', { name: /Final-drive gears: the \d+ pairs/ })
	).toBeVisible();
	await expect(page.getByText('One tooth taller on the primary gears').first()).toBeVisible();
});

test('three builds side by side, with their differences marked', async ({ page }) => {
	await open(page, '/builds?view=table&q=one+change');
	const boxes = page.getByRole('checkbox', { name: /Pick .* for side by side/ });
	await expect(boxes.first()).toBeVisible();
	for (let i = 0; i < 3; i++) await boxes.nth(i).check();
	await page.getByRole('button', { name: 'Side by side (3)' }).click();
	await expect(page).toHaveURL(/\/side-by-side\?builds=\d+&builds=\d+&builds=\d+/);
	const table = page.getByRole('table');
	await expect(table.locator('thead th')).toHaveCount(5); // marker, field, three builds
	const differing = table.locator('tr[data-differs="yes"]');
	await expect(differing.first()).toBeVisible();
	await expect(differing.first()).toContainText('differs'); // said in words, not colour alone
	const all = await table.locator('tbody tr[data-differs]').count();
	await page.getByLabel(/only rows that differ/).check();
	await expect.poll(() => table.locator('tbody tr[data-differs]').count()).toBeLessThan(all);
	await expect(table.locator('tr[data-differs="no"]')).toHaveCount(0);
});

test('a misspelt part name still finds its builds', async ({ page }) => {
	await open(page, '/builds');
	// Typing is enough: the list follows once typing pauses, and the address with it.
	await page.getByLabel('Search titles, stories and part names').fill('Halvrad');
	await expect(page.getByRole('status')).toContainText('Did you mean halvard?');
	await expect(page).toHaveURL(/[?&]q=Halvrad/);
	const first = page.getByRole('article').first();
	await first.getByRole('link').click();
	await expect(page.getByRole('region', { name: 'What each step cost' })).toContainText('Halvard');
});

test('the home page shows the community: the latest sheets and the newest steps that counted', async ({
	page
}) => {
	await page.goto('/');
	await expect(page.getByText('on their way')).toHaveCount(0);
	const latest = page.getByRole('region', { name: 'Latest build sheets' });
	await expect(latest.getByRole('article')).toHaveCount(6);
	const steps = page.getByRole('region', { name: 'Newest steps that count in change effects' });
	await expect(steps.getByRole('listitem').first()).toContainText(/[+−±]\d+\.\d\s?km\/h/);
	await steps.getByRole('listitem').first().getByRole('link').click();
	await expect(page).toHaveURL(/\/builds\/\d+$/);
});

test.describe('filters on a phone', () => {
	test.use({ viewport: { width: 390, height: 844 } });
	test('apply as they change, with the address updated, and no trip back up to a button', async ({
		page
	}) => {
		await open(page, '/builds');
		await page.getByText('Filters', { exact: true }).click();
		await page.getByLabel('Exhaust now').selectOption('expansion-chamber');
		await expect(page).toHaveURL(/exhaust=expansion-chamber/);
		await page.getByRole('checkbox', { name: 'with measured runs' }).check();
		await expect(page).toHaveURL(/runs=1/);
		await expect(page.getByRole('button', { name: 'Show' })).toHaveCount(0);
		const cards = page.getByRole('article');
		await expect(cards.first()).toBeVisible();
		await page.reload();
		await expect(page.getByLabel('Exhaust now')).toHaveValue('expansion-chamber');
	});
});

test.describe('filters without JavaScript', () => {
	test.use({ javaScriptEnabled: false });
	test('still apply with the button at the end of the form', async ({ page }) => {
		await page.goto('/builds');
		await page.getByText('Filters', { exact: true }).click();
		await page.getByLabel('Exhaust now').selectOption('stock');
		await page.getByRole('button', { name: 'Show' }).click();
		await expect(page).toHaveURL(/exhaust=stock/);
	});

	test('the speed map shows its chart, marks linked to their builds, and changes on the button', async ({
		page
	}) => {
		await page.goto('/speed-map?x=displacement');
		const chart = page.locator('.speed-map-chart svg:has([aria-label="dot"])');
		await expect(chart).toBeVisible();
		const box = (await chart.boundingBox())!;
		expect(box.width).toBeGreaterThan(200);
		const marks = chart.locator('[aria-label="dot"] a');
		expect(await marks.count()).toBeGreaterThan(5);
		await expect(marks.first()).toHaveAttribute('href', /^\/builds\/\d+$/);
		await expect(chart.locator('[aria-label="dot"] title').first()).toContainText(/km\/h/);

		const settings = page.getByRole('form', { name: 'Speed map settings' });
		await settings.getByLabel('Across').selectOption('elevation');
		await settings.getByLabel('expansion chamber').check();
		await settings.getByRole('button', { name: 'Show' }).click();
		await expect(page).toHaveURL(/x=elevation/);
		await expect(page).toHaveURL(/pipe=expansion-chamber/);
		await expect(page.locator('.speed-map-chart figure')).toContainText('Elevation of the run');
	});

	test('the speed map’s table is on a page of its own', async ({ page }) => {
		await page.goto('/speed-map?x=displacement&pipe=expansion-chamber');
		await page.getByText('The same data as a table').click();
		await page.getByRole('link', { name: 'The table on a page of its own' }).click();
		await expect(page).toHaveURL(/\/speed-map\/table\?x=displacement&pipe=expansion-chamber/);
		const exhausts = await page.getByRole('table').locator('tbody td:nth-child(3)').allInnerTexts();
		expect(exhausts.length).toBeGreaterThan(0);
		expect(new Set(exhausts)).toEqual(new Set(['expansion chamber']));
	});
});

test('the speed map page carries its drawing once, and its table’s rows only when opened', async ({
	page
}) => {
	const html = await (await page.request.get('/speed-map?x=displacement')).text();
	// One drawing in the HTML, and the page's data without the marks it draws.
	expect(html.match(/aria-label="dot"/g)?.length).toBe(1);
	expect(html).toContain('marksLeftOut');
	expect(html).not.toContain('<tbody><tr>');
	// The rows come when the table is opened, the count with the page: another test publishing a
	// build in between makes them differ once, so the page is opened again until they agree.
	await expect(async () => {
		await open(page, '/speed-map?x=displacement');
		await page.getByText('The same data as a table').click();
		const rows = page.getByRole('table').locator('tbody tr');
		await expect(rows.first()).toBeVisible();
		expect(await rows.count()).toBe(
			Number((await page.getByTestId('map-count').innerText()).replace(/,/g, ''))
		);
	}).toPass({ timeout: 20_000 });
	// The chart the server drew is still there after waking, not drawn again.
	await expect(page.locator('.speed-map-chart svg:has([aria-label="dot"])')).toHaveCount(1);
});

test('side by side picks from cards, a build page and the table, kept across pages, and says when it is full', async ({
	page
}) => {
	await open(page, '/builds?sort=fastest');
	const cards = page.getByRole('article');
	const first = (await cards.nth(0).getByRole('heading').innerText()).trim();
	await cards
		.nth(0)
		.getByRole('button', { name: /side by side/ })
		.click();
	await expect(cards.nth(0).getByRole('button', { name: /in side by side/ })).toHaveAttribute(
		'aria-pressed',
		'true'
	);
	// A build page further down the list.
	const href = await cards.nth(5).getByRole('heading').getByRole('link').getAttribute('href');
	await open(page, href!);
	await page
		.getByRole('button', { name: /^\+ side by side/ })
		.first()
		.click();
	const trayBar = page.getByRole('complementary', { name: 'Picked for side by side' });
	await expect(trayBar).toContainText('Side by side (2 of 4)');
	await expect(trayBar).toContainText(first);
	// The table, on another page of results: two more ticks fill it, a fifth is refused in words.
	// (Fastest first: the newest builds may be other tests' sheets, deleted while this one runs.)
	await open(page, '/builds?view=table&sort=fastest');
	const boxes = page.getByRole('checkbox', { name: /^Pick .* for side by side$/ });
	let ticked = 0;
	for (let i = 0; ticked < 3; i++) {
		const box = boxes.nth(i);
		if (await box.isChecked()) continue;
		ticked++;
		if (ticked < 3) await box.check();
		else {
			await box.click();
			await expect(box).not.toBeChecked();
			await expect(trayBar).toContainText('Side by side holds 4 builds');
		}
	}
	await expect(trayBar).toContainText('Side by side (4 of 4)');
	await trayBar.getByRole('link', { name: 'Compare' }).click();
	await expect(page).toHaveURL(/\/side-by-side\?builds=\d+,\d+,\d+,\d+$/);
	await expect(page.getByRole('table').locator('thead th')).toHaveCount(6); // marker, field, four
});

test('side by side says when more builds were asked for than fit', async ({ page }) => {
	await page.goto('/side-by-side?builds=1,2,3,4,5');
	await expect(page.getByRole('status').first()).toContainText('one more was left out');
});
