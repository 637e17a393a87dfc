import { expect, test } from '@playwright/test';
import * as builds from '../../src/lib/server/sheet/builds';
import * as runs from '../../src/lib/server/sheet/runs';
import { saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { FIXTURE_SETUP, fixtureRun } from '../support/sheet-fixtures';
import { publishedBuild } from '../support/moderation-fixtures';
import { hydrated, makeUser, open, signInWithPassword } from './support';

// At the track, on a phone: the next run in two taps and the speed, place and air carried over.
test.use({ viewport: { width: 390, height: 844 } });

test('a member logs a run from the build page with place and air carried over', async ({
	page
}) => {
	const me = await makeUser({ password: 'Track-day-2026' });
	const { build, setupId } = await publishedBuild(me.id, 'Quick log fixture');
	// The latest run (by date) is the one carried over: 640 m, 24 °C, radar.
	await saveRun(build.id, setupId, fixtureRun(66, { elevation: 640, temp: 24, method: 'radar' }));
	const later = {
		...fixtureRun(67, { elevation: 640, temp: 24, method: 'radar' }),
		runOn: '2026-06-02'
	};
	await saveRun(build.id, setupId, later);

	await signInWithPassword(page, me.email, 'Track-day-2026', `/builds/${build.id}`);
	await page.waitForURL(new RegExp(`/builds/${build.id}$`));
	await hydrated(page);
	await page.getByRole('link', { name: 'Add a run' }).click();
	await expect(page.getByTestId('carried-over')).toContainText('2026-06-02');
	await hydrated(page);
	await expect(page.getByLabel(/^Site elevation/)).toHaveValue('640');
	await expect(page.getByLabel(/^Air temperature/)).toHaveValue('24');
	await expect(page.getByLabel(/^Measured with/)).toHaveValue('radar');
	await expect(page.getByLabel(/^Top speed/)).toHaveValue('');
	await page.getByLabel(/^Top speed/).fill('68.5');
	await page.getByRole('button', { name: 'Save run' }).click();
	await page.waitForURL(new RegExp(`/builds/${build.id}/edit`));

	const sheet = await (await page.request.get(`/api/builds/${build.id}`)).json();
	const speeds = JSON.stringify(sheet);
	expect(speeds).toContain('68.5');
});

test('the bench offers "Add a run" and "Next setup" on each card', async ({ page }) => {
	const me = await makeUser({ password: 'Bench-card-2026' });
	const { build, setupId } = await publishedBuild(me.id, 'Bench card fixture');
	await signInWithPassword(page, me.email, 'Bench-card-2026', '/bench');
	await page.waitForURL(/\/bench$/);
	await open(page, '/bench');
	await expect(page.getByRole('link', { name: 'Add a run to Bench card fixture' })).toHaveAttribute(
		'href',
		`/builds/${build.id}/setups/${setupId}/runs/new`
	);
	await expect(
		page.getByRole('link', { name: 'Next setup of Bench card fixture' })
	).toHaveAttribute('href', `/builds/${build.id}/setups/new`);

	// "Next setup" starts from the last one and asks first what changed.
	await page.getByRole('link', { name: 'Next setup of Bench card fixture' }).click();
	await page.waitForURL(/\/setups\/new$/);
	await expect(page.getByLabel(/^What changed/)).toBeFocused();
	await expect(page.getByLabel(/^What changed/)).toHaveValue('');
	await expect(page.getByLabel(/^Main jet/)).toHaveValue('92');
});

test('a save that meets no signal says so, keeps what was typed and can be pressed again', async ({
	page,
	context
}) => {
	// The build's own sheet does not wait on the device (runs and setups do: offline.spec.ts).
	const me = await makeUser({ password: 'No-signal-2026' });
	const { build } = await publishedBuild(me.id, 'No signal fixture');
	await signInWithPassword(page, me.email, 'No-signal-2026', `/builds/${build.id}`);
	await page.waitForURL(new RegExp(`/builds/${build.id}$`));
	await open(page, `/builds/${build.id}/edit`);
	await page.getByLabel(/^Title/).fill('No signal fixture, 70 cc');
	await context.setOffline(true);
	await page.getByRole('button', { name: 'Save the build' }).click();
	await expect(page.getByTestId('not-sent')).toContainText('Not sent — your entries are kept');
	await expect(page.getByRole('button', { name: 'Save the build' })).toBeEnabled();
	await expect(page.getByLabel(/^Title/)).toHaveValue('No signal fixture, 70 cc');
	await context.setOffline(false);
	await page.getByRole('button', { name: 'Save the build' }).click();
	await expect(page.getByText('Saved.')).toBeVisible();
	expect(
		JSON.stringify(await (await page.request.get(`/api/builds/${build.id}`)).json())
	).toContain('No signal fixture, 70 cc');
});

test('the first run can be logged with just its speed, method and date', async ({ page }) => {
	const me = await makeUser({ password: 'First-run-2026' });
	const b = await builds.create(me.id, {
		title: 'First run fixture',
		chassis: 'Fenwick Lark 12-inch'
	});
	const s = (await saveSetup(b.id, { ...FIXTURE_SETUP, changeNote: 'Stock' })) as { id: number };
	await signInWithPassword(
		page,
		me.email,
		'First-run-2026',
		`/builds/${b.id}/setups/${s.id}/runs/new`
	);
	await page.waitForURL(/\/runs\/new$/);
	await hydrated(page);
	await expect(page.getByTestId('carried-over')).toHaveCount(0); // nothing to carry yet
	await page.getByLabel(/^Top speed/).fill('49.8');
	await page.getByLabel(/^Measured with/).selectOption('phone-gps');
	await page.getByLabel(/^Relative humidity/).fill(''); // the form's 50 % guess taken back
	await page.getByRole('button', { name: 'Save run' }).click();
	await page.waitForURL(new RegExp(`/builds/${b.id}/edit`));
	const [run] = await runs.listForBuild(b.id);
	expect([Number(run.speedKmh), run.method, run.venue, run.elevationM]).toEqual([
		49.8,
		'phone-gps',
		null,
		null
	]);
});
