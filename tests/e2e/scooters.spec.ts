import { expect, test } from '@playwright/test';
import { makeUser, open, signInWithPassword } from './support';

// A newcomer with a stock scooter, on a phone: finds it in the catalogue by a name typed from
// memory, reads what the factory fitted, and sees the build sheets that started from it.
test.use({ viewport: { width: 390, height: 844 } });

test('finds a base scooter by a misspelt name and sees its stock data and build sheets', async ({
	page
}) => {
	await open(page, '/scooters');
	await page.getByLabel('Maker, model or engine').fill('Tesly Urbno');
	await page.getByRole('button', { name: 'Find' }).click();
	await expect(page).toHaveURL(/q=Tesly\+Urbno/);
	const best = page.getByRole('row').nth(1);
	await expect(best).toContainText('Tessly Urbano 50 (2014–2020)');
	await best.getByRole('link', { name: 'Tessly Urbano 50 (2014–2020)' }).click();

	await expect(page.getByRole('heading', { level: 1 })).toHaveText('Tessly Urbano 50 (2014–2020)');
	const stock = page.getByRole('region', { name: 'As it left the factory' });
	await expect(stock).toContainText('13/42 · 13/46');
	await expect(stock).toContainText('120/70-12 51L');
	await expect(page.getByText('Restrictors are fitted to keep a scooter')).toBeVisible();
	const builds = page.getByRole('region', { name: 'Build sheets on this scooter' });
	await expect(builds.getByRole('article').first()).toContainText('Tessly Urbano no.');
	// Nothing on the page is wider than the phone.
	expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
});

test('a member starts a build sheet from a scooter and finds the stock baseline filled in', async ({
	page
}) => {
	const me = await makeUser();
	await signInWithPassword(page, me.email, me.password);
	await open(page, '/builds/new');
	await page.getByLabel('Maker and model').fill('Kobrn Metro');
	await page.getByRole('button', { name: 'Find' }).click();
	await page.getByRole('link', { name: 'Kobrin Metro 50 (2006–2013)' }).click();
	await expect(page.getByText('Starting from')).toBeVisible();
	await expect(page.getByLabel('Chassis (frame, wheel size, year)')).toHaveValue(
		'Kobrin Metro 50 (2006–2013)'
	);
	await expect(page.getByLabel('Engine family')).toHaveValue('Kestrel 1E40 air, horizontal');
	const title = `Metro from the catalogue ${Date.now()}`;
	await page.getByLabel('Title').fill(title);
	await page.getByRole('button', { name: 'Save draft and add the first setup' }).click();

	// The stock baseline as the catalogue has it: only what differs needs typing.
	await expect(page).toHaveURL(/\/setups\/new$/);
	await expect(page.getByLabel('Carburettor bore')).toHaveValue('12');
	await expect(page.getByLabel('First stage: driven teeth')).toHaveValue('43');
	await expect(page.getByLabel('Rear tyre size')).toHaveValue('3.50-10 51J');
	await expect(page.getByLabel('Roller weights per slot')).toHaveValue('6x5.5');
});
