import { expect, test } from '@playwright/test';
import * as users from '../../src/lib/server/auth/users';
import { demoAccount, makeUser, signInWithPassword } from './support';

const origin = process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3100';

test('an anonymous visitor is sent to sign-in from the review desk, and API callers get 401', async ({
	page
}) => {
	await page.goto('/review');
	await expect(page).toHaveURL('/signin?next=%2Freview');
	const api = await page.request.get('/api/review/notes');
	expect(api.status()).toBe(401);
	expect(await api.json()).toMatchObject({ error: 'Sign in first.', issues: [] });
});

test('a member gets 403 on the review desk page, its form action and its API route', async ({
	page
}) => {
	const u = await makeUser();
	await signInWithPassword(page, u.email, u.password);
	await expect(page.getByRole('banner')).toContainText('Sign out');

	const res = await page.goto('/review');
	expect(res?.status()).toBe(403);
	await expect(page.getByRole('heading', { name: 'Not on your bench' })).toBeVisible();

	const action = await page.request.post('/review?/note', {
		form: { body: 'a member trying to pin a note' },
		headers: { origin }
	});
	expect(action.status()).toBe(403);

	const get = await page.request.get('/api/review/notes');
	expect(get.status()).toBe(403);
	const post = await page.request.post('/api/review/notes', {
		data: { body: 'hello desk' },
		headers: { origin }
	});
	expect(post.status()).toBe(403);
});

test('a moderator pins a desk note that the API then lists; bad input is refused', async ({
	page
}) => {
	const m = demoAccount('moderator');
	await signInWithPassword(page, m.email, m.password, '/review');
	await expect(page.getByRole('heading', { name: 'Review desk' })).toBeVisible();
	const body = `Watch the pipe threads this week ${Date.now()}`;
	await page.getByLabel('Leave a note for the other moderators').fill(body);
	await page.getByRole('button', { name: 'Pin the note' }).click();
	await expect(page.getByRole('status')).toContainText('Note pinned');
	await expect(page.getByText(body)).toBeVisible();

	const list = await page.request.get('/api/review/notes');
	expect(list.status()).toBe(200);
	expect((await list.json()).notes.map((n: { body: string }) => n.body)).toContain(body);

	const bad = await page.request.post('/api/review/notes', {
		data: { body: '' },
		headers: { origin }
	});
	expect(bad.status()).toBe(422);
	expect((await bad.json()).issues[0].path).toBe('body');
	const broken = await page.request.post('/api/review/notes', {
		data: Buffer.from('{not json'),
		headers: { origin, 'content-type': 'application/json' }
	});
	expect(broken.status()).toBe(400);
});

test('a role change and a suspension take effect on the next request', async ({ browser }) => {
	const a = await makeUser();
	const b = await makeUser();
	const pa = await (await browser.newContext()).newPage();
	const pb = await (await browser.newContext()).newPage();
	await signInWithPassword(pa, a.email, a.password);
	await signInWithPassword(pb, b.email, b.password);
	await expect(pa.getByRole('banner')).toContainText('[member]');
	await expect(pb.getByRole('banner')).toContainText('Sign out');
	expect((await pa.goto('/review'))?.status()).toBe(403);

	await users.update(a.id, { role: 'moderator' });
	await users.update(b.id, { suspendedAt: new Date(), suspendedReason: 'test' });

	expect((await pa.goto('/review'))?.status()).toBe(200);
	await expect(pa.getByRole('banner')).toContainText('[moderator]');
	// Suspended: still signed in to read, told why on every page; changes are refused (403).
	expect((await pb.goto('/profile'))?.status()).toBe(200);
	await expect(pb.getByRole('alert').filter({ hasText: 'suspended' })).toContainText('test');
	await pb.getByRole('button', { name: /save/i }).first().click();
	await expect(pb.getByText(/suspended/).first()).toBeVisible();

	await users.update(a.id, { role: 'member' });
	expect((await pa.goto('/review'))?.status()).toBe(403);
});
