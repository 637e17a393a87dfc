import { expect, test } from '@playwright/test';

// Float noise such as 0.9400000000000001 must never reach a reader: not on a build page, not in an
// exported sheet. The demo data computes its values (0.8 + 0.05 …), so it is a fair sample.
const NOISE = /\d\.\d*0{6,}\d|\d\.\d*9{6,}\d/;

test('build pages and exported sheets show measured values as they were written', async ({
	page
}) => {
	await page.goto('/builds?view=table&sort=fastest');
	const ids = await page
		.getByRole('link', { name: /./ })
		.evaluateAll((as) => [
			...new Set(
				as
					.map((a) => (a as HTMLAnchorElement).pathname.match(/^\/builds\/(\d+)$/)?.[1])
					.filter(Boolean)
			)
		]);
	expect(ids.length).toBeGreaterThanOrEqual(6);
	for (const id of ids.slice(0, 6)) {
		await page.goto(`/builds/${id}`);
		for (const d of await page.locator('details').all())
			await d.evaluate((e) => e.setAttribute('open', ''));
		const text = await page.locator('main').innerText();
		expect(text.match(NOISE)?.[0] ?? null, `/builds/${id}`).toBeNull();
		const exported = await (await page.request.get(`/api/builds/${id}/export`)).text();
		expect(exported.match(NOISE)?.[0] ?? null, `/api/builds/${id}/export`).toBeNull();
	}
});
