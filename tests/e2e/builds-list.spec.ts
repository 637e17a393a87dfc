import { expect, test } from '@playwright/test';

test.describe('cheapest parts first, for a reader in Britain', () => {
	test.use({ locale: 'en-GB' });
	test('orders pound prices only, cheapest first, and leaves builds with no parts out', async ({
		page
	}) => {
		await page.goto('/builds?sort=cheapest');
		await expect(page.getByLabel('Costs in')).toHaveValue('GBP');
		await expect(page.getByRole('status')).toContainText('priced in GBP');
		const prices = await page
			.getByRole('article')
			.locator('dt:text-is("Parts") + dd')
			.allInnerTexts();
		expect(prices.length).toBeGreaterThan(3);
		for (const p of prices) expect(p).toMatch(/^£\d/);
		const amounts = prices.map((p) => Number(p.replace(/[£,]/g, '')));
		expect(amounts.every((a) => a > 0)).toBe(true);
		expect(amounts).toEqual([...amounts].sort((a, b) => a - b));
	});
});
