import { expect, test } from '@playwright/test';
import { saveRun } from '../../src/lib/server/sheet/service';
import { fixtureRun } from '../support/sheet-fixtures';
import { publishedBuild } from '../support/moderation-fixtures';
import { hydrated, makeUser, open, signInWithPassword } from './support';

// Nothing typed is lost: a reload, a wrong tap on a link, a switch of units or a dead signal.
test.use({ viewport: { width: 390, height: 844 } });

async function member(page: import('@playwright/test').Page, title: string) {
	const me = await makeUser({ password: 'Draft-keeper-2026' });
	const { build, setupId } = await publishedBuild(me.id, title);
	await saveRun(build.id, setupId, fixtureRun(66, { elevation: 640, temp: 24, method: 'radar' }));
	await signInWithPassword(page, me.email, 'Draft-keeper-2026', `/builds/${build.id}`);
	await page.waitForURL(new RegExp(`/builds/${build.id}$`));
	return { me, build, setupId, runPage: `/builds/${build.id}/setups/${setupId}/runs/new` };
}

test('a reload brings back the unsent draft, and it can be discarded', async ({ page }) => {
	const { runPage } = await member(page, 'Draft reload fixture');
	await open(page, runPage);
	await page.getByLabel(/^Top speed/).fill('69.4');
	await page.getByLabel(/^Air temperature/).fill('31');
	page.on('dialog', (d) => d.accept()); // the browser's own "leave this page?"
	await page.reload();
	await hydrated(page);
	await expect(page.getByTestId('draft-restored')).toContainText('Restored your unsent draft');
	await expect(page.getByLabel(/^Top speed/)).toHaveValue('69.4');
	await expect(page.getByLabel(/^Air temperature/)).toHaveValue('31');

	await page.getByRole('button', { name: 'discard it' }).click();
	await expect(page.getByTestId('draft-restored')).toHaveCount(0);
	await expect(page.getByLabel(/^Top speed/)).toHaveValue('');
	await expect(page.getByLabel(/^Air temperature/)).toHaveValue('24'); // carried over again
	await page.reload();
	await hydrated(page);
	await expect(page.getByTestId('draft-restored')).toHaveCount(0);
});

test('leaving a form with unsent changes asks first', async ({ page }) => {
	const { build } = await member(page, 'Draft leave fixture');
	await open(page, `/builds/${build.id}/setups/new`);
	await page.getByLabel(/^What changed/).fill('Rollers 7.5 g → 6.5 g');
	let asked = '';
	page.once('dialog', (d) => {
		asked = d.message();
		void d.dismiss();
	});
	await page.getByRole('link', { name: 'Bench', exact: true }).click();
	await expect.poll(() => asked).toContain('not sent yet');
	await expect(page).toHaveURL(new RegExp(`/setups/new`));
	await expect(page.getByLabel(/^What changed/)).toHaveValue('Rollers 7.5 g → 6.5 g');

	page.once('dialog', (d) => void d.accept());
	await page.getByRole('link', { name: 'Bench', exact: true }).click();
	await page.waitForURL(/\/bench$/);
});

test('switching units keeps the typed values, converted', async ({ page }) => {
	const { runPage } = await member(page, 'Draft units fixture');
	await open(page, `${runPage}?units=metric`);
	await page.getByLabel(/^Top speed/).fill('70');
	await page.getByLabel(/^Site elevation/).fill('640');
	await page.getByRole('link', { name: 'switch to imperial' }).click();
	await page.waitForURL(/units=imperial/);
	await hydrated(page);
	// NIST SP 811, Appendix B: 70 km/h ÷ 1.609344 = 43.5 mph; 640 m ÷ 0.3048 = 2,100 ft;
	// 24 °C × 1.8 + 32 = 75.2 °F (the carried-over temperature, shown in °F by the server).
	await expect(page.getByLabel(/^Top speed/)).toHaveValue('43.5');
	await expect(page.getByLabel(/^Site elevation/)).toHaveValue('2100');
	await expect(page.getByLabel(/^Air temperature/)).toHaveValue('75.2');
	await expect(page.getByText('mph').first()).toBeVisible();
});

test('drafts are per account: signing out leaves none behind', async ({ page }) => {
	const { runPage } = await member(page, 'Draft sign-out fixture');
	await open(page, runPage);
	await page.getByLabel(/^Top speed/).fill('72.5');
	const kept = () =>
		page.evaluate(() => Object.keys(localStorage).filter((k) => k.startsWith('sl-draft:')).length);
	await expect.poll(kept).toBe(1);
	page.on('dialog', (d) => void d.accept());
	await page.getByRole('button', { name: 'Sign out' }).click();
	await expect(page.getByRole('banner').getByRole('link', { name: 'Sign in' })).toBeVisible();
	await hydrated(page);
	await expect.poll(kept).toBe(0);
});

test('a comment that meets no signal says so and keeps its words', async ({ page, context }) => {
	const { build } = await member(page, 'Draft comment fixture');
	await open(page, `/builds/${build.id}`);
	const box = page.getByLabel(/^Your comment/);
	await box.fill('The 6.5 g rollers held 8,900 rpm up the hill.');
	await context.setOffline(true);
	await page.getByRole('button', { name: 'Post the comment' }).click();
	await expect(page.getByTestId('not-sent')).toContainText('Not sent — your entries are kept');
	await expect(box).toHaveValue('The 6.5 g rollers held 8,900 rpm up the hill.');
	await context.setOffline(false);
	await page.getByRole('button', { name: 'Post the comment' }).click();
	await expect(page.getByRole('article', { name: /Comment by/ })).toContainText('8,900 rpm');
});
