import { expect, test } from '@playwright/test';
import { open } from './support';

// Skimming the list must not load every build it passes over: a build page costs the server
// several queries, so its data is fetched when the reader presses on a link, not on hover.
test('hovering over build cards loads no build page; pressing one goes there', async ({ page }) => {
	const loaded: string[] = [];
	page.on('request', (r) => {
		if (/\/builds\/\d+\/__data\.json/.test(r.url())) loaded.push(r.url());
	});
	await open(page, '/builds?sort=fastest');
	const links = page.getByRole('article').getByRole('heading').getByRole('link');
	const count = Math.min(await links.count(), 8);
	expect(count).toBeGreaterThan(2);
	for (let i = 0; i < count; i++) {
		await links.nth(i).hover();
		await page.waitForTimeout(150);
	}
	expect(loaded).toEqual([]);
	await links.nth(0).click();
	await expect(page).toHaveURL(/\/builds\/\d+$/);
	expect(loaded.length).toBe(1);
});
