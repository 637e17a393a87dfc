import { expect, test } from '@playwright/test';
import { demoAccount, linkInMail, makeUser, openNewestMail, signInWithPassword } from './support';

for (const role of ['member', 'moderator', 'shop', 'admin'] as const) {
	test(`${role === 'admin' ? 'an' : 'a'} ${role} signs in with a password`, async ({ page }) => {
		const a = demoAccount(role);
		await signInWithPassword(page, a.email, a.password);
		await expect(page).toHaveURL('/');
		const header = page.getByRole('banner');
		await expect(header.getByRole('link', { name: new RegExp(a.name) })).toContainText(`[${role}]`);
		await header.getByRole('button', { name: 'Sign out' }).click();
		await expect(header.getByRole('link', { name: 'Sign in' })).toBeVisible();
	});
}

test('a wrong password says so, keeps the address and changes nothing', async ({ page }) => {
	const u = await makeUser();
	await signInWithPassword(page, u.email, 'not my password at all');
	const form = page.getByRole('form', { name: 'With your password' });
	await expect(form.getByRole('alert')).toContainText('do not match an account');
	await expect(form.getByLabel('E-mail')).toHaveValue(u.email);
	await expect(form.getByLabel('Password')).toHaveValue('');
	await signInWithPassword(page, u.email, u.password);
	await expect(page.getByRole('banner')).toContainText('Sign out');
});

test('signs in with a link read from the outbox; the link works only once', async ({
	page,
	context
}) => {
	const u = await makeUser();
	await page.goto('/signin');
	const form = page.getByRole('form', { name: 'With a link by mail' });
	await form.getByLabel('E-mail').fill(u.email);
	await form.getByRole('button', { name: 'Mail me a link' }).click();
	await expect(page.getByRole('heading', { name: 'Check your mail' })).toBeVisible();

	await openNewestMail(page, u.email, /sign-in link/);
	const link = await linkInMail(page, '/auth/callback/link');
	await page.goto(link);
	await expect(page.getByRole('banner')).toContainText('Sign out');

	await context.clearCookies();
	await page.goto(link);
	await expect(
		page.getByRole('heading', { name: 'That sign-in link no longer works' })
	).toBeVisible();
	await expect(page.getByRole('banner')).toContainText('Sign in');
});

test('a suspended member signs in read-only and is told why and until when', async ({ page }) => {
	const u = await makeUser({ suspended: true });
	await signInWithPassword(page, u.email, u.password);
	const alert = page.getByRole('alert').filter({ hasText: 'suspended' });
	await expect(alert).toContainText('until the desk lifts it: test');
	await expect(alert).toContainText('not post, comment, report or message');
});
