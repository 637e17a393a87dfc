import { randomUUID } from 'node:crypto';
import { expect, test } from '@playwright/test';
import { linkInMail, makeUser, openNewestMail, signInWithPassword } from './support';

test('a newcomer joins through the confirmation mail, then signs in', async ({ page }) => {
	const email = `new-${randomUUID().slice(0, 8)}@tests.squishline.test`;
	const password = 'two-stroke smoke rings';
	await page.goto('/signup');
	await page.getByLabel('Name shown on your sheets').fill('Newcomer Nell');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password', { exact: true }).fill(password);
	await page.getByLabel('Password again').fill('a different one!');
	await page.getByRole('checkbox').check();
	await page.getByRole('button', { name: 'Open my bench' }).click();
	await expect(page.getByText('The two passwords differ.')).toBeVisible();
	await expect(page.getByLabel('E-mail')).toHaveValue(email);

	await page.getByLabel('Password', { exact: true }).fill(password);
	await page.getByLabel('Password again').fill(password);
	await page.getByRole('button', { name: 'Open my bench' }).click();
	await expect(page.getByRole('heading', { name: /confirm your address/ })).toBeVisible();

	// Before confirming, the password is refused with the reason.
	await signInWithPassword(page, email, password);
	await expect(page.getByRole('alert')).toContainText('Confirm your e-mail address first');

	await openNewestMail(page, email, /Confirm your address/);
	await page.goto(await linkInMail(page, '/verify/'));
	await page.getByRole('button', { name: 'Confirm my address' }).click();
	await expect(page.getByText('Address confirmed.')).toBeVisible();

	await signInWithPassword(page, email, password);
	await expect(page.getByRole('banner')).toContainText('Newcomer Nell');
});

test('a member resets a forgotten password by mail', async ({ page }) => {
	const u = await makeUser();
	await page.goto('/reset');
	await page.getByLabel('E-mail').fill(u.email);
	await page.getByRole('button', { name: 'Mail me a reset link' }).click();
	await expect(page.getByRole('status')).toContainText('a reset link is on its way');

	await openNewestMail(page, u.email, /Reset your Squishline password/);
	const link = await linkInMail(page, '/reset/');
	await page.goto(link);
	await page.getByLabel('New password', { exact: true }).fill('short');
	await page.getByLabel('New password again').fill('short');
	await page.getByRole('button', { name: 'Save the new password' }).click();
	await expect(page.getByText('Use at least 10 characters.').first()).toBeVisible();

	await page.getByLabel('New password', { exact: true }).fill('a much longer password');
	await page.getByLabel('New password again').fill('a much longer password');
	await page.getByRole('button', { name: 'Save the new password' }).click();
	await expect(page.getByText('Password changed.')).toBeVisible();

	await signInWithPassword(page, u.email, u.password);
	await expect(page.getByRole('alert')).toContainText('do not match');
	await signInWithPassword(page, u.email, 'a much longer password');
	await expect(page.getByRole('banner')).toContainText('Sign out');

	// The link is spent.
	await page.goto(link);
	await expect(page.getByRole('alert')).toContainText('used already');
});

test('a member saves their profile', async ({ page }) => {
	const u = await makeUser();
	await signInWithPassword(page, u.email, u.password, '/profile');
	await expect(page).toHaveURL('/profile');
	await page.getByLabel('Display name').fill('Renamed Rider');
	await page.getByLabel(/Imperial/).check();
	await page.getByRole('checkbox', { name: /Comments on my builds/ }).uncheck();
	await page.getByRole('button', { name: 'Save profile' }).click();
	await expect(page.getByRole('status')).toHaveText(/Saved/);
	await page.reload();
	await expect(page.getByLabel('Display name')).toHaveValue('Renamed Rider');
	await expect(page.getByLabel(/Imperial/)).toBeChecked();
	await expect(page.getByRole('checkbox', { name: /Comments on my builds/ })).not.toBeChecked();
});

test('a member changes their password on the profile, is signed out, and signs in with the new one', async ({
	page
}) => {
	const u = await makeUser({ password: 'first password 1' });
	await signInWithPassword(page, u.email, 'first password 1', '/profile');
	await expect(page.getByLabel(/news/i)).toHaveCount(0); // no mail option that sends nothing
	await page.getByLabel('Current password').fill('not my password');
	await page.getByLabel('New password', { exact: true }).fill('second password 2');
	await page.getByLabel('New password again').fill('second password 2');
	await page.getByRole('button', { name: 'Change the password' }).click();
	await expect(page.getByText('That is not your current password.')).toBeVisible();
	await expect(page.getByLabel('New password', { exact: true })).toHaveValue('second password 2');
	await page.getByLabel('Current password').fill('first password 1');
	await page.getByRole('button', { name: 'Change the password' }).click();
	await expect(page.getByText(/Password changed, and every device signed out/)).toBeVisible();
	await signInWithPassword(page, u.email, 'second password 2');
	await expect(page.getByRole('banner')).toContainText('Sign out');
});
