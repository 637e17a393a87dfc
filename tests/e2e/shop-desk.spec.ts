import { expect, test } from '@playwright/test';
import { demoAccount, open, signInWithPassword } from './support';

test('the sheet to hand over starts at "Choose a sheet…", and sending none says so in words', async ({
	page
}) => {
	const shop = demoAccount('shop');
	await signInWithPassword(page, shop.email, shop.password);
	await expect(page.getByRole('banner')).toContainText('Sign out');
	await open(page, '/shop');
	const select = page.getByLabel('Sheet to hand over');
	// Not blank: a visible prompt, and the shop's sheets below it.
	await expect(select.locator('option:checked')).toHaveText('Choose a sheet…');
	expect(await select.locator('option').count()).toBeGreaterThan(1);

	// A browser that ignores `required` still gets words, not a parser's message.
	await page.getByLabel('Customer’s e-mail').fill('customer@squishline.test');
	await select.evaluate((el) => el.removeAttribute('required'));
	await page.getByRole('button', { name: 'Offer it' }).click();
	await expect(
		page.getByRole('alert').filter({ hasText: 'Choose the sheet to hand over.' })
	).toBeVisible();
	await expect(page.getByText(/NaN/)).toHaveCount(0);
});
