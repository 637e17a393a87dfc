import { expect, test, type Page } from '@playwright/test';
import { makeUser, signInWithPassword } from './support';

async function fill(page: Page, values: Record<string, string>) {
	// Typing before hydration finishes can be overwritten when the page takes over.
	await page.waitForLoadState('networkidle');
	for (const [label, value] of Object.entries(values))
		await page.getByLabel(label, { exact: false }).first().fill(value);
}

test('a member records a build with a baseline, a second setup, runs and parts, and publishes it', async ({
	page
}) => {
	test.setTimeout(90_000);
	const u = await makeUser();
	await signInWithPassword(page, u.email, u.password, '/builds/new');
	const title = `Harbour commuter to 70 cc ${Date.now()}`;
	await fill(page, {
		Title: title,
		'Chassis (frame': 'Tessly Urbano 12-inch (2018)',
		'Engine family': 'horizontal 50 cc two-stroke',
		'Front brake': '190 mm disc',
		'Rear brake': '110 mm drum'
	});
	await page.getByRole('button', { name: 'Save draft and add the first setup' }).click();

	await expect(page.getByRole('heading', { name: 'The first setup' })).toBeVisible();
	await expect(page.getByLabel('This is the stock baseline')).toBeChecked();
	// Nothing is guessed: an untouched select would save "not recorded", never its first option.
	await expect(page.getByLabel('Lubrication')).toHaveValue('');
	await expect(page.getByLabel('Lubrication').locator('option:checked')).toHaveText('not recorded');
	await page.getByLabel('Lubrication').selectOption('oil-injection');
	await page.getByLabel('Cylinder material').selectOption('cast-iron');
	await page.getByLabel('Jet series numbered').selectOption('diameter');
	await fill(page, {
		Bore: '40',
		Stroke: '39.2',
		'Squish clearance': '1.0',
		'Carburettor bore': '12',
		'Main jet': '80',
		'Roller weights': '6x5.5',
		'First stage: driver': '13',
		'First stage: driven': '43',
		'Second stage: driver': '13',
		'Second stage: driven': '47',
		'Rear tyre size': '120/70-12 51J',
		'Top CVT ratio': '0.95',
		'Peak rpm': '7000'
	});
	await page.getByRole('button', { name: 'Save setup' }).click();
	await expect(page.getByRole('link', { name: '1. Stock baseline' })).toBeVisible();

	await page.getByRole('link', { name: 'Add a run' }).first().click();
	await fill(page, {
		'Top speed': '52',
		'Site elevation': '200',
		'Air temperature': '18',
		'Relative humidity': '60'
	});
	await expect(page.getByLabel('Measured with')).toHaveValue('');
	await page.getByRole('button', { name: 'Save run' }).click();
	await expect(page.getByText('Choose one.')).toHaveCount(1); // how it was measured (where may wait)
	await page.getByLabel('Measured with').selectOption('gps-logger');
	await page.getByLabel('Where').selectOption('closed-course');
	await page.getByRole('button', { name: 'Save run' }).click();
	await expect(page.getByRole('link', { name: /52\.0 km\/h/ })).toBeVisible();

	await page.getByRole('link', { name: 'Add the next setup' }).click();
	await expect(page.getByLabel('Bore').first()).toHaveValue('40'); // a copy of the previous setup
	await fill(page, {
		'What changed': '70 cc kit, pipe, jet 92',
		Bore: '47',
		'Main jet': '92',
		'First stage: driver': '15',
		'Top CVT ratio': '0.82',
		'Peak rpm': '10500'
	});
	await page.getByLabel('Exhaust type').selectOption('expansion-chamber');
	await page.getByRole('button', { name: 'Save setup' }).click();
	await page.getByRole('link', { name: 'Add a run' }).nth(1).click();
	await fill(page, {
		'Top speed': '98',
		'Site elevation': '200',
		'Air temperature': '21',
		'Relative humidity': '50'
	});
	await page.getByLabel('Measured with').selectOption('gps-logger');
	await page.getByLabel('Where').selectOption('closed-course');
	await page.getByRole('button', { name: 'Save run' }).click();

	const parts = page.getByRole('form', { name: 'Add a part' });
	await parts.getByLabel('Category').selectOption('cylinder');
	await parts
		.getByLabel('First fitted in setup')
		.selectOption({ label: '2. 70 cc kit, pipe, jet 92' });
	await parts.getByLabel('Part').fill('Brannoch 70 cc cast-iron kit');
	await parts.getByLabel('Cost').fill('189.00');
	await parts.getByRole('button', { name: 'Add the part' }).click();
	await expect(
		page.getByRole('cell', { name: 'Brannoch 70 cc cast-iron kit', exact: true })
	).toBeVisible();
	await parts.getByLabel('Category').selectOption('exhaust');
	await parts
		.getByLabel('First fitted in setup')
		.selectOption({ label: '2. 70 cc kit, pipe, jet 92' });
	await parts.getByLabel('Part').fill('Halvard expansion chamber');
	await parts.getByLabel('Cost').fill('149.50');
	await parts.getByRole('button', { name: 'Add the part' }).click();
	await expect(
		page.getByRole('cell', { name: 'Halvard expansion chamber', exact: true })
	).toBeVisible();
	// A typo in a price is fixed in place, not by removing the part and adding it again.
	await page.getByRole('link', { name: 'Edit Halvard expansion chamber' }).click();
	await expect(page.getByLabel('Cost')).toHaveValue('149.5');
	await page.getByLabel('Cost').fill('159.50');
	await page.getByRole('button', { name: 'Save the part' }).click();
	await expect(page.getByRole('cell', { name: '€159.50' })).toBeVisible();

	await page.getByRole('button', { name: 'Publish the build sheet' }).click();
	await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
	await expect(
		page.getByText('Tessly Urbano 12-inch (2018)').filter({ visible: true }).first()
	).toBeVisible();
	await expect(page.getByText('190 mm disc').filter({ visible: true }).first()).toBeVisible();
	// Displacement π/4 · 47² · 39.2 = 68.0 cc; the diff names the changed fields.
	await expect(page.getByRole('row', { name: /Displacement 68\.0 cc/ })).toBeVisible();
	const baseline = page.getByRole('group').filter({ hasText: 'Full configuration' }).first();
	await baseline.getByText('Full configuration').click();
	await expect(baseline.locator('dt:text-is("Lubrication") + dd')).toHaveText('oil injection');
	const changes = page.getByRole('list', { name: 'Changes from the previous setup' });
	await expect(changes).toContainText('Bore');
	await expect(changes).toContainText('40.00 mm');
	await expect(changes).toContainText('47.00 mm');
	await expect(changes).toContainText('expansion chamber');
	// (189.00 + 159.50) / (98 − 52) km/h = 7.576 per km/h.
	await expect(page.getByTestId('cost-per-speed')).toHaveText('€7.58');
	// The parts told as the build went: setup 2 fitted both, and its runs gave 98 − 52 = 46 km/h.
	const spend = page.getByRole('region', { name: 'What each step cost' });
	await expect(
		spend.getByRole('heading', { name: 'Setup 2: 70 cc kit, pipe, jet 92' })
	).toBeVisible();
	await expect(spend.getByTestId('step-spend')).toHaveText(
		/Step cost €348\.50\s+gave \+46\.0\skm\/h · €7\.58 per km\/h/
	);
	// The printed sheet tells the parts the same way.
	await page.emulateMedia({ media: 'print' });
	await expect(
		page.getByRole('row', { name: /Setup 2: 70 cc kit, pipe, jet 92 €348\.50/ })
	).toBeVisible();
	await page.emulateMedia({ media: 'screen' });
	await expect(
		page.getByText("above the tyre's speed symbol").filter({ visible: true }).first()
	).toBeVisible();

	await page.getByRole('link', { name: 'switch to imperial' }).click();
	await expect(page.getByText('60.9 mph').filter({ visible: true }).first()).toBeVisible(); // 98 km/h ÷ 1.609344
	await expect(page.getByText('656 ft').filter({ visible: true }).first()).toBeVisible(); // 200 m ÷ 0.3048
	await expect(page.getByText('69.8 °F').filter({ visible: true }).first()).toBeVisible(); // 21 °C × 1.8 + 32
	await expect(page.getByTestId('cost-per-speed')).toHaveText('€12.19'); // per mph: 7.576 × 1.609344

	await page.goto(`/builds?q=${encodeURIComponent(title)}`);
	await expect(page.getByRole('link', { name: title })).toBeVisible();
});

test.describe('without JavaScript', () => {
	test.use({ javaScriptEnabled: false });
	test('the sheet can still be created and saved', async ({ page }) => {
		const u = await makeUser();
		await signInWithPassword(page, u.email, u.password, '/builds/new', false);
		await page.getByLabel('Title').fill('No-script build');
		await page.getByRole('button', { name: 'Save draft and add the first setup' }).click();
		await expect(page.getByRole('heading', { name: 'The first setup' })).toBeVisible();
		await fill(page, { Bore: '41', Stroke: '39.2' });
		await page.getByRole('button', { name: 'Save setup' }).click();
		await expect(page.getByRole('link', { name: '1. Stock baseline' })).toBeVisible();
		await page.getByLabel('Title').last().fill('No-script build, renamed');
		await page.getByRole('button', { name: 'Save the build' }).click();
		await expect(page.getByText('Saved.')).toBeVisible();
		await page.getByRole('link', { name: 'view the sheet' }).click();
		await expect(page.getByRole('heading', { level: 1 })).toHaveText('No-script build, renamed');
		await expect(page.getByRole('row', { name: /Displacement 51\.8 cc/ })).toBeVisible();
	});
});

test('an exported sheet imports as a new draft from the new-build page; a broken one lists its problems', async ({
	page
}) => {
	const u = await makeUser();
	await signInWithPassword(page, u.email, u.password);
	await expect(page.getByRole('banner')).toContainText('Sign out');
	const list = await (await page.request.get('/api/builds?sort=fastest&limit=1')).json();
	const source = list.builds[0];
	const exported = await (await page.request.get(`/api/builds/${source.id}/export`)).json();
	await page.goto('/builds/new');
	await page.getByLabel('Exported sheet (.json)').setInputFiles({
		name: 'sheet.json',
		mimeType: 'application/json',
		buffer: Buffer.from(JSON.stringify(exported))
	});
	await page.getByRole('button', { name: 'Import as a new draft' }).click();
	await expect(page).toHaveURL(/\/builds\/\d+\/edit$/);
	await expect(page.getByRole('heading', { level: 1 })).toContainText(source.title);
	await expect(page.getByRole('heading', { level: 1 })).toContainText('[draft]');

	await page.goto('/builds/new');
	const broken = {
		...exported,
		build: { ...exported.build, title: '' },
		setups: [{ changeNote: 'x', config: { bore: 500 } }]
	};
	await page.getByLabel('Exported sheet (.json)').setInputFiles({
		name: 'sheet.json',
		mimeType: 'application/json',
		buffer: Buffer.from(JSON.stringify(broken))
	});
	await page.getByRole('button', { name: 'Import as a new draft' }).click();
	const problems = page.getByRole('alert');
	await expect(problems).toContainText('build.title');
	await expect(problems).toContainText('setups.0.config.bore');
});

test('the public list loads more sheets from the JSON API in the browser', async ({ page }) => {
	await page.goto('/builds');
	await page.waitForLoadState('networkidle');
	const cards = page.getByRole('article');
	await expect(cards).toHaveCount(24);
	const api = page.waitForResponse((r) => r.url().includes('/api/builds?') && r.status() === 200);
	await page.getByRole('link', { name: 'Load more sheets' }).click();
	await api;
	await expect.poll(() => cards.count()).toBeGreaterThan(24);
	await expect(page).toHaveURL('/builds'); // fetched in place, no navigation
});
