import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { publishedBuild } from '../support/moderation-fixtures';
import { makeUser, open, signInWithPassword } from './support';

// Both themes on the main pages, read by axe-core (WCAG 2.x A and AA rules): nothing serious or
// critical, contrast included. The dark theme is reached as a device that prefers it would; each
// page is opened once and read in both.
test.slow(); // axe reads each page whole, twice

async function problems(page: Page) {
	const { violations } = await new AxeBuilder({ page })
		.withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'])
		.analyze();
	return violations
		.filter((v) => v.impact === 'serious' || v.impact === 'critical')
		.map(
			(v) =>
				`${v.id}: ${v.help} — ${v.nodes
					.map((n) => n.target.join(' '))
					.slice(0, 3)
					.join(' | ')}`
		);
}

const ground = (page: Page) =>
	page.evaluate(() => getComputedStyle(document.documentElement).backgroundColor);

/** Each page in the light theme, then the dark, as the device asks. */
async function bothThemes(page: Page, urls: string[]) {
	for (const url of urls) {
		await page.emulateMedia({ colorScheme: 'light' });
		await open(page, url);
		expect(await ground(page)).toBe('rgb(246, 241, 231)'); // --sl-paper, light (app.css)
		expect(await problems(page), `${url}, light`).toEqual([]);
		await page.emulateMedia({ colorScheme: 'dark' });
		expect(await ground(page)).toBe('rgb(28, 27, 25)'); // --sl-paper, dark
		expect(await problems(page), `${url}, dark`).toEqual([]);
	}
}

test('the public pages have no serious accessibility problems in either theme', async ({
	page
}) => {
	const me = await makeUser();
	const { build } = await publishedBuild(me.id, 'Axe fixture');
	await bothThemes(page, ['/', '/builds', `/builds/${build.id}`, '/close', '/speed-map']);
});

test('the other public pages have no serious accessibility problems in either theme', async ({
	page
}) => {
	await bothThemes(page, [
		'/change-effects',
		'/slide-rule',
		'/slide-rule/retune',
		'/shops',
		'/scooters',
		'/scooters/1',
		'/signin'
	]);
});

test('a member’s pages have no serious accessibility problems in either theme', async ({
	page
}) => {
	const me = await makeUser({ password: 'Axe-member-2026' });
	const { build, setupId } = await publishedBuild(me.id, 'Axe member fixture');
	await signInWithPassword(page, me.email, 'Axe-member-2026', '/bench');
	await page.waitForURL(/\/bench$/);
	await bothThemes(page, [
		'/bench',
		`/builds/${build.id}/edit`,
		`/builds/${build.id}/setups/${setupId}/runs/new`,
		'/builds/new?find=urbano',
		'/scooters/propose',
		'/profile'
	]);
});

test('a member’s own choice of dark pages holds on a device that prefers light', async ({
	page
}) => {
	const me = await makeUser({ password: 'Dark-choice-2026' });
	await signInWithPassword(page, me.email, 'Dark-choice-2026', '/profile');
	await page.waitForURL(/\/profile$/);
	await open(page, '/profile');
	await page.getByRole('radio', { name: /^Dark/ }).check();
	await page.getByRole('button', { name: /^Save/ }).first().click();
	await expect(page.getByText('Saved.')).toBeVisible();
	await page.emulateMedia({ colorScheme: 'light' });
	await open(page, '/bench');
	await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
	expect(await ground(page)).toBe('rgb(28, 27, 25)');
});
