import { expect, test } from '@playwright/test';
import { publishedBuild } from '../support/moderation-fixtures';
import { makeUser, open, signInWithPassword } from './support';

// A member's pages are written in their browser's locale; public pages, shared by caches, in
// en-GB. Units stay the member's own choice either way.
test.use({ locale: 'de-DE' });

test('a member reading in German gets German numbers; the public page stays one text', async ({
	page,
	browser
}) => {
	const me = await makeUser({ password: 'Zahlen-2026-Werkstatt' });
	const { build } = await publishedBuild(me.id, 'Locale fixture');
	await signInWithPassword(page, me.email, 'Zahlen-2026-Werkstatt', '/bench');
	await page.waitForURL(/\/bench$/);
	await open(page, '/bench');
	await expect(page.getByText('70,0 km/h').filter({ visible: true }).first()).toBeVisible();
	// Moving to another page in the browser writes the same way.
	await page.getByRole('link', { name: 'Locale fixture' }).first().click();
	await page.waitForURL(new RegExp(`/builds/${build.id}$`));
	await expect(page.getByText('70,0 km/h').filter({ visible: true }).first()).toBeVisible();

	const reader = await browser.newContext({ locale: 'de-DE' });
	const anonymous = await reader.newPage();
	await open(anonymous, `/builds/${build.id}`);
	await expect(anonymous.getByText('70.0 km/h').filter({ visible: true }).first()).toBeVisible();
	await reader.close();
});
