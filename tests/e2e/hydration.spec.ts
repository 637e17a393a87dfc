import { expect, test } from '@playwright/test';
import { publishedBuild } from '../support/moderation-fixtures';
import { makeUser, signInWithPassword } from './support';

// The cause of the moderation test's flake, and a loss for a real reader on a slow phone: words
// typed into a comment box before the page's scripts arrive were wiped when the page went live.
test('a comment typed while the page is still loading is still there when it goes live', async ({
	page
}) => {
	const u = await makeUser();
	const { build } = await publishedBuild(u.id, `Slow connection ${Date.now()}`);
	await signInWithPassword(page, u.email, u.password);
	await expect(page.getByRole('banner')).toContainText('Sign out');
	// Hold the page's scripts back until the words are typed, as a slow connection does.
	let release: () => void = () => {};
	const held = new Promise<void>((r) => (release = r));
	await page.route(/\/_app\/immutable\/.*\.js$/, async (route) => {
		await held;
		await route.continue();
	});
	await page.goto(`/builds/${build.id}#comments`, { waitUntil: 'commit' });
	const box = page.locator('textarea[name="body"]').first();
	await box.fill('Typed before the scripts arrived.');
	release();
	await page.waitForSelector('html[data-hydrated]');
	await expect(box).toHaveValue('Typed before the scripts arrived.');
	// And it posts as typed.
	await page.getByRole('button', { name: 'Post the comment' }).click();
	await expect(page.getByRole('article', { name: /Comment by/ }).first()).toContainText(
		'Typed before the scripts arrived.'
	);
});
