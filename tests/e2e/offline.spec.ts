import { expect, test, type Page } from '@playwright/test';
import * as runs from '../../src/lib/server/sheet/runs';
import * as setups from '../../src/lib/server/sheet/setups';
import { saveSetup } from '../../src/lib/server/sheet/service';
import { FIXTURE_SETUP } from '../support/sheet-fixtures';
import { phonePhoto } from '../support/photos';
import { publishedBuild } from '../support/moderation-fixtures';
import { hydrated, makeUser, open, signInWithPassword } from './support';

// At the track without a signal: the app opens from this device, saves wait here and go in order.
test.use({ viewport: { width: 390, height: 844 }, serviceWorkers: 'allow' });

/** Waits until the service worker answers this page's requests (so it keeps copies of pages). */
async function workerInCharge(page: Page) {
	await page.evaluate(async () => {
		await navigator.serviceWorker.ready;
		if (!navigator.serviceWorker.controller)
			await new Promise((r) => navigator.serviceWorker.addEventListener('controllerchange', r));
	});
}

/** Opens pages while there is a signal, so their copies are kept for later. */
async function openOnline(page: Page, ...urls: string[]) {
	for (const url of urls) await open(page, url);
}

async function member(page: Page, title: string) {
	const me = await makeUser({ password: 'Track-side-2026' });
	const { build, setupId } = await publishedBuild(me.id, title);
	await signInWithPassword(page, me.email, 'Track-side-2026', '/bench');
	await page.waitForURL(/\/bench$/);
	await open(page, '/bench');
	await workerInCharge(page);
	return { me, build, setupId };
}

test('the installed app opens the bench offline', async ({ page, context }) => {
	const { build } = await member(page, 'Offline bench fixture');
	const manifest = await (await page.request.get('/manifest.webmanifest')).json();
	expect(manifest.start_url).toBe('/bench');
	expect(manifest.icons.map((i: { sizes: string }) => i.sizes)).toEqual(
		expect.arrayContaining(['192x192', '512x512'])
	);
	await openOnline(page, '/bench', `/builds/${build.id}`);

	await context.setOffline(true);
	await page.goto('/bench');
	await expect(page.getByRole('heading', { level: 1 })).toContainText(/bench/i);
	await expect(page.getByText('Offline bench fixture').first()).toBeVisible();
	await page.goto(`/builds/${build.id}`);
	await expect(page.getByRole('heading', { level: 1 })).toContainText('Offline bench fixture');
	// A page never opened here says so instead of the browser's error.
	await page.goto('/slide-rule/premix');
	await expect(page.getByRole('heading', { name: 'No signal' })).toBeVisible();
	await context.setOffline(false);
});

test('a setup and a run made offline survive a reload, wait, and are accepted in order', async ({
	page,
	context
}) => {
	const { build, setupId } = await member(page, 'Offline queue fixture');
	const setupPage = `/builds/${build.id}/setups/new`;
	const runPage = `/builds/${build.id}/setups/${setupId}/runs/new`;
	await openOnline(page, setupPage, runPage);
	page.on('dialog', (d) => void d.accept()); // "leave this page?" on reloads with a draft

	await context.setOffline(true);
	await open(page, setupPage);
	await page.getByLabel(/^What changed/).fill('Main jet 92 → 95 for the cold morning');
	await page.getByLabel(/^Main jet/).fill('95');
	await open(page, runPage);
	await page.getByLabel(/^Top speed/).fill('71.4');

	await page.reload();
	await hydrated(page);
	await expect(page.getByTestId('draft-restored')).toBeVisible();
	await expect(page.getByLabel(/^Top speed/)).toHaveValue('71.4');
	await open(page, setupPage);
	await expect(page.getByTestId('draft-restored')).toBeVisible();
	await expect(page.getByLabel(/^What changed/)).toHaveValue(
		'Main jet 92 → 95 for the cold morning'
	);

	await page.getByRole('button', { name: 'Save setup' }).click();
	await expect(page.getByTestId('queued-here')).toContainText('waiting to send');
	await open(page, runPage);
	await page.getByRole('button', { name: 'Save run' }).click();
	const queue = page.getByTestId('send-queue');
	await expect(queue).toContainText('2 waiting to send');
	await expect(queue.getByTestId('queued').nth(0)).toContainText('A new setup');
	await expect(queue.getByTestId('queued').nth(1)).toContainText('A run of 71.4');

	await context.setOffline(false);
	await expect(queue.getByTestId('queued').nth(0)).toContainText('accepted');
	await expect(queue.getByTestId('queued').nth(1)).toContainText('accepted');
	const made = await setups.listForBuild(build.id);
	expect(made.map((s) => s.changeNote)).toEqual([
		'Kit on',
		'Main jet 92 → 95 for the cold morning'
	]);
	const logged = (await runs.listForBuild(build.id)).map((r) => Number(r.speedKmh));
	expect(logged).toContain(71.4);
	expect(logged).toHaveLength(2); // the first run and this one: sent once
	// Nothing is left waiting on the device.
	expect(
		await page.evaluate(() => Object.keys(localStorage).filter((k) => k.startsWith('sl-queue:')))
	).toEqual([]);
});

test('a queued change against a setup edited elsewhere is shown beside it and nothing is lost', async ({
	page,
	context
}) => {
	const { build, setupId } = await member(page, 'Offline conflict fixture');
	const editPage = `/builds/${build.id}/setups/${setupId}/edit`;
	await openOnline(page, editPage);

	await context.setOffline(true);
	await open(page, editPage);
	await page.getByLabel(/^Main jet/).fill('98');
	await page.getByLabel(/^Needle clip/).fill('3');
	await page.getByRole('button', { name: 'Save setup' }).click();
	await expect(page.getByTestId('send-queue')).toContainText('1 waiting to send');

	// Meanwhile, from the workshop computer: the pilot jet and the needle clip changed.
	const before = (await setups.read(build.id, setupId))!;
	await saveSetup(
		build.id,
		{ ...FIXTURE_SETUP, changeNote: 'Kit on', pilotJet: 40, needleClip: 4 },
		{ id: setupId, version: before.version }
	);

	await context.setOffline(false);
	const conflict = page.getByRole('table', { name: "Your change beside the server's" });
	await expect(conflict).toBeVisible();
	await expect(page.getByTestId('send-queue')).toContainText('meets a newer version');
	const row = (label: RegExp) => conflict.getByRole('row').filter({ hasText: label });
	await expect(row(/^Main jet/)).toContainText('98');
	await expect(row(/^Main jet/)).toContainText('92');
	await expect(row(/^Pilot jet/)).toContainText('40');
	await expect(row(/^Needle clip/)).toContainText('3');
	await expect(row(/^Needle clip/)).toContainText('4');
	// Nothing was saved yet.
	expect(Number((await setups.read(build.id, setupId))!.config.mainJet)).toBe(92);

	// Mine for the main jet and the needle clip; the server's pilot jet stays.
	await row(/^Pilot jet/)
		.getByRole('radio')
		.nth(1)
		.check();
	await page.getByRole('button', { name: 'Save the values chosen' }).click();
	await expect(page.getByTestId('send-queue')).toContainText('accepted');
	const saved = (await setups.read(build.id, setupId))!.config as Record<string, unknown>;
	expect(saved.mainJet).toBe(98);
	expect(saved.needleClip).toBe(3);
	expect(saved.pilotJet).toBe(40);
});

test('a photo chosen without a signal waits on the device and goes once the signal is back', async ({
	page,
	context
}) => {
	const { build } = await member(page, 'Offline photo fixture');
	const editPage = `/builds/${build.id}/edit`;
	await openOnline(page, editPage);
	await context.setOffline(true);
	await open(page, editPage);
	await page.getByLabel('Caption', { exact: true }).first().fill('Crushed solder at 0.8 mm');
	await page
		.getByLabel(/^Photo \(JPEG/)
		.setInputFiles({ name: 'solder.jpg', mimeType: 'image/jpeg', buffer: await phonePhoto() });
	await page.getByRole('button', { name: 'Upload the photo' }).click();
	await expect(page.getByTestId('photo-kept')).toContainText('waiting to send');
	const queue = page.getByTestId('send-queue');
	await expect(queue).toContainText('A photo (“Crushed solder at 0.8 mm”)');
	await expect(queue).toContainText('1 waiting to send');

	await context.setOffline(false);
	await expect(queue.getByTestId('queued').first()).toContainText('accepted');
	const photos = (await (await page.request.get(`/api/builds/${build.id}/photos`)).json()).photos;
	expect(photos.map((p: { caption: string }) => p.caption)).toEqual(['Crushed solder at 0.8 mm']);
	// The page shows it without a reload, and the file is no longer kept on the device.
	await expect(page.getByRole('img', { name: /Crushed solder/ })).toBeVisible();
	expect(
		await page.evaluate(
			() =>
				new Promise<number>((resolve) => {
					const open = indexedDB.open('squishline-offline');
					open.onsuccess = () => {
						const count = open.result.transaction('files').objectStore('files').count();
						count.onsuccess = () => resolve(count.result);
					};
				})
		)
	).toBe(0);
});
