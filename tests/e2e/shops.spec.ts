import { expect, test, type Browser, type Page } from '@playwright/test';
import { publishedBuild } from '../support/moderation-fixtures';
import { linkInMail, makeUser, openNewestMail, signInWithPassword } from './support';

async function as(browser: Browser, who: { email: string; password: string }): Promise<Page> {
	const page = await (await browser.newContext()).newPage();
	await signInWithPassword(page, who.email, who.password);
	await expect(page.getByRole('banner')).toContainText('Sign out');
	return page;
}

/** A shop account that has set up its page through the shop desk. */
async function shopWithPage(browser: Browser, name: string) {
	const account = await makeUser({ role: 'shop' });
	const page = await as(browser, account);
	await page.goto('/shop');
	await page.getByLabel('Shop name').fill(name);
	await page.getByLabel('Region').fill('Lowfield');
	await page.getByLabel('Services').fill('Kits fitted, jetting, CVT tuning.');
	await page.getByRole('button', { name: 'Create the shop page' }).click();
	await expect(page.getByText('Saved. Your shop page shows it now.')).toBeVisible();
	await expect(page.getByRole('link', { name: `Your shop page: ${name}` })).toBeVisible();
	return { account, page };
}

test('a shop asks to be named on a build, the owner approves by mail, the admin stamps the shop; a used link says so', async ({
	browser
}) => {
	test.setTimeout(90_000);
	const name = `Lowfield Tuning ${Date.now()}`;
	const shop = await shopWithPage(browser, name);
	const owner = await makeUser();
	const title = `Shop link flow ${Date.now()}`;
	const { build } = await publishedBuild(owner.id, title);

	// From the build's own page, as the shop.
	await shop.page.goto(`/builds/${build.id}`);
	await shop.page.getByLabel(`What ${name} did`).selectOption('tuned');
	await shop.page.getByRole('button', { name: 'Ask the owner to name us' }).click();
	await expect(shop.page.getByRole('row', { name: new RegExp(title) })).toContainText(
		'waiting for the owner'
	);

	// The owner approves from the mail, without signing in.
	const o = await (await browser.newContext()).newPage();
	await openNewestMail(o, owner.email, /asks to be shown as having tuned/);
	const approve = await linkInMail(o, '/links/');
	await o.goto(approve);
	await expect(o.getByRole('heading', { name: 'Approve this link?' })).toBeVisible();
	await o.getByRole('button', { name: 'Approve the link' }).click();
	await expect(o.getByRole('heading', { name: 'Link approved' })).toBeVisible();

	// The admin checks and stamps the shop.
	const admin = await as(browser, await makeUser({ role: 'admin' }));
	await admin.goto('/admin/shops');
	const row = admin.getByTestId('shop-row').filter({ hasText: name });
	await row.getByLabel(`What you checked about ${name}`).fill('Visited the workshop');
	await row.getByRole('button', { name: `Verify ${name}` }).click();
	await expect(admin.getByRole('status')).toContainText('Stamped as a verified shop');

	// Readers see the shop on the build, with its stamp.
	const reader = await (await browser.newContext()).newPage();
	await reader.goto(`/builds/${build.id}`);
	const credit = reader.getByRole('list', { name: 'Shops named on this build' });
	await expect(credit).toContainText(`tuned by ${name}`);
	await expect(credit.getByText('verified shop')).toBeVisible();
	// On the list, the stamp on the member's card names the shop.
	await reader.goto(`/builds?q=${encodeURIComponent(title)}`);
	const card = reader.getByRole('article').filter({ hasText: title });
	await expect(card).toContainText(`verified shop: ${name}`);

	// The same mailed link again: a clear page, nothing changed.
	await o.goto(approve);
	await expect(o.getByRole('heading', { name: 'This link has already been used' })).toBeVisible();
	await expect(o.getByText('nothing was changed')).toBeVisible();
});

test('a shop fills in a build for a customer and hands it over; the customer accepts by mail and it is theirs', async ({
	browser
}) => {
	test.setTimeout(90_000);
	const name = `Quay Street Engines ${Date.now()}`;
	const shop = await shopWithPage(browser, name);
	const customer = await makeUser();
	const title = `Customer build ${Date.now()}`;

	await shop.page.goto('/builds/new');
	await shop.page.getByLabel('Title').fill(title);
	await shop.page.getByRole('button', { name: 'Save draft and add the first setup' }).click();
	await expect(shop.page.getByRole('heading', { name: 'The first setup' })).toBeVisible();

	await shop.page.goto('/shop#handovers');
	await shop.page.getByLabel('Sheet to hand over').selectOption({ label: `${title} (draft)` });
	await shop.page.getByLabel('Customer’s e-mail').fill(customer.email);
	await shop.page.getByRole('button', { name: 'Offer it' }).click();
	const offers = shop.page.getByRole('region', { name: 'Hand a build sheet to a customer' });
	await expect(offers.getByRole('row', { name: new RegExp(title) })).toContainText(
		'waiting for the customer'
	);

	const c = await as(browser, customer);
	await openNewestMail(c, customer.email, /hands you the build sheet/);
	const accept = await linkInMail(c, '/handover/');
	await c.goto(accept);
	await c.getByRole('button', { name: 'Take it onto my bench' }).click();
	await expect(c.getByRole('heading', { name: 'The build sheet is yours' })).toBeVisible();
	await c.getByRole('link', { name: 'Open it' }).click();
	await expect(c.getByRole('heading', { level: 1 })).toHaveText(title);
	await expect(c.getByRole('link', { name: 'Edit the sheet' })).toBeVisible();
	await expect(c.getByRole('list', { name: 'Shops named on this build' })).toContainText(
		`built by ${name}`
	);
	await c.goto('/bench');
	await expect(c.getByRole('link', { name: title, exact: true })).toBeVisible();

	// The shop no longer has it (reload: the desk is already open at this address).
	await shop.page.reload();
	await expect(offers.getByRole('row', { name: new RegExp(title) })).toContainText(
		'taken over by the customer'
	);
	await shop.page.goto('/bench');
	await expect(shop.page.getByRole('link', { name: title })).toHaveCount(0);
});

test('a member deletes their account and keeps their published sheet without their name', async ({
	page
}) => {
	const u = await makeUser();
	const title = `Leaving build ${Date.now()}`;
	const { build } = await publishedBuild(u.id, title);
	await signInWithPassword(page, u.email, u.password, '/profile/delete');
	await page.getByRole('button', { name: 'Delete my account' }).click();
	// Nothing chosen, nothing typed: told what is missing, nothing deleted.
	await expect(page.getByRole('alert')).toContainText('Choose what happens to your builds');
	await page.getByLabel('Keep them without my name').check();
	await page.getByLabel('Type “delete my account” to confirm').fill('delete my account');
	await page.getByRole('button', { name: 'Delete my account' }).click();
	await expect(page.getByRole('status')).toContainText('Your account is deleted');
	await expect(page.getByRole('banner').getByRole('link', { name: 'Sign in' })).toBeVisible();
	await page.goto(`/builds/${build.id}`);
	await expect(page.getByRole('heading', { level: 1 })).toHaveText(title);
	await expect(page.getByText('by a former member')).toBeVisible();
});
