import { expect, test } from '@playwright/test';
import { hydrated, makeUser, open, signInWithPassword } from './support';
import type { Browser } from '@playwright/test';

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
	await signInWithPassword(page, me.email, me.password, '/builds/new');
	await expect(page).toHaveURL(/\/builds\/new$/);
	await hydrated(page);
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

async function signedIn(browser: Browser, who: { email: string; password: string }) {
	const page = await (
		await browser.newContext({ viewport: { width: 390, height: 844 } })
	).newPage();
	await signInWithPassword(page, who.email, who.password);
	await expect(page.getByRole('banner')).toContainText('Sign out');
	return page;
}

test('a member proposes a missing scooter, starts from it at once, and a moderator accepts it into the catalogue', async ({
	browser
}) => {
	test.setTimeout(90_000);
	const model = `Lark ${Date.now() % 100000}`;
	const name = `Fenwick ${model} (2019–now)`;
	const member = await signedIn(browser, await makeUser());
	await open(member, '/scooters');
	await member.getByRole('link', { name: 'Propose a scooter' }).click();
	await expect(member.getByRole('heading', { level: 1 })).toHaveText('Propose a base scooter');
	await member.getByLabel('Maker', { exact: true }).fill('Fenwick');
	await member.getByLabel('Model', { exact: true }).fill(model);
	await member.getByLabel('First year made').fill('2019');
	// A first try without the engine: refused with the reason, and what was typed is kept.
	await member.getByRole('button', { name: 'Propose this scooter' }).click();
	await expect(member.getByRole('alert')).toContainText('Pick the engine from the list');
	await expect(member.getByLabel('Model', { exact: true })).toHaveValue(model);
	await member.getByLabel('Engine family').selectOption({ label: 'Kestrel 1E40 air, horizontal' });
	await member.getByLabel('Carburettor bore (mm)').fill('12');
	await member.getByRole('button', { name: 'Propose this scooter' }).click();
	await expect(member.getByRole('heading', { level: 1 })).toHaveText(name);
	await expect(member.getByText('Proposed: usable on your own build sheets now')).toBeVisible();
	await member.getByRole('link', { name: 'Start a build sheet from this scooter' }).click();
	await expect(member.getByText(`Starting from ${name}`)).toBeVisible();
	// Not in the public catalogue yet.
	const visitor = await (await browser.newContext()).newPage();
	await open(visitor, `/scooters?q=Fenwick ${model}`);
	await expect(visitor.getByRole('link', { name })).toHaveCount(0);

	const moderator = await signedIn(browser, await makeUser({ role: 'moderator' }));
	await open(moderator, '/review');
	const card = moderator.getByRole('article', { name });
	await card.getByLabel('Reason (kept in the log)').fill('checked against the owner’s papers');
	await card.getByRole('button', { name: 'Accept into the catalogue' }).click();
	await expect(moderator.getByText('Accepted into the catalogue. Logged.')).toBeVisible();
	await open(moderator, '/review/log');
	await expect(
		moderator.getByRole('row', { name: /Accepted a scooter into the catalogue/ }).first()
	).toBeVisible();

	await open(visitor, `/scooters?q=Fenwick ${model}`);
	await expect(visitor.getByRole('link', { name })).toBeVisible();
});
