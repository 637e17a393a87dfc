import { expect, test, type Page } from '@playwright/test';
import { hydrated, makeUser, open, signInWithPassword } from './support';
import { FORMS } from '../../src/lib/slide-rule/form-defs';
import { toInput } from '../../src/lib/slide-rule/forms';
import type { CalcResult, CalculatorName, Units } from '../../src/lib/slide-rule';

const origin = process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3100';

/** What the page shows, by result key. */
async function shown(page: Page): Promise<Record<string, string>> {
	const cells = page.locator('td[data-key]');
	await expect(cells.first()).toBeVisible();
	const out: Record<string, string> = {};
	for (const c of await cells.all())
		out[(await c.getAttribute('data-key'))!] = (await c.innerText()).trim();
	return out;
}

/** Posts the state the page keeps in its URL to the API and checks every shown number matches. */
async function matchesApi(page: Page, name: CalculatorName) {
	await expect(page).toHaveURL(/units=/);
	const params = Object.fromEntries(new URL(page.url()).searchParams);
	const input = toInput(FORMS[name], params, params.units as Units);
	const res = await page.request.post(`/api/slide-rule/${name}`, {
		data: input,
		headers: { origin }
	});
	expect(res.status()).toBe(200);
	const api = (await res.json()) as CalcResult;
	const onPage = await shown(page);
	expect(Object.keys(onPage).sort()).toEqual(api.rows.map((r) => r.key).sort());
	// The same decimals as the API's value; a change (signed) with its + or − sign.
	for (const r of api.rows) {
		const plain = Math.abs(r.value).toFixed(r.decimals);
		const sign = Number(plain) === 0 ? '' : r.value < 0 ? '\u2212' : r.signed ? '+' : '';
		expect(onPage[r.key], r.key).toBe(sign + plain);
	}
	return { api, onPage };
}

const cases: {
	name: CalculatorName;
	fill: Record<Units, Record<string, string>>;
	expectKey: string;
}[] = [
	{
		name: 'cylinder',
		fill: {
			metric: { Bore: '50', Stroke: '39.2', 'Combustion chamber volume': '7' },
			imperial: { Bore: '1.9685', Stroke: '1.5433' }
		},
		expectKey: 'displacement'
	},
	{
		name: 'gearing',
		fill: {
			metric: { 'Peak engine speed': '9800', 'Rear tyre size': '130/60-13 53P' },
			imperial: { 'Peak engine speed': '9000', 'Stock top speed (measured)': '30' }
		},
		expectKey: 'topSpeed'
	},
	{
		name: 'air-and-jets',
		fill: {
			metric: { Elevation: '800', 'Air temperature': '31', 'Main jet (optional)': '96' },
			imperial: { Elevation: '6000', 'Air pressure': '29.5' }
		},
		expectKey: 'density'
	},
	{
		name: 'retune',
		fill: {
			metric: { 'Main jet that runs right there': '100', 'Ridden at: Elevation': '1800' },
			imperial: { 'Jetted at: Elevation': '300', 'Ridden at: Elevation': '7000' }
		},
		expectKey: 'physicsJet'
	},
	{
		name: 'pipe',
		fill: {
			metric: { 'Exhaust duration': '190', 'Engine speed the pipe should work at': '10000' },
			imperial: { 'Exhaust gas temperature in the pipe': '950' }
		},
		expectKey: 'tunedLength'
	},
	{
		name: 'time-area',
		fill: {
			metric: { 'Exhaust port width (chord)': '33', 'Engine speed of peak power': '10500' },
			imperial: { 'Exhaust port width (chord)': '1.3' }
		},
		expectKey: 'exhaustSta'
	},
	{
		name: 'carb',
		fill: {
			metric: { Displacement: '70', 'Engine speed of peak power': '10500' },
			imperial: { 'Constant K': '0.7' }
		},
		expectKey: 'bore'
	},
	{
		name: 'dial-gauge',
		fill: {
			metric: { Stroke: '40', Timing: '18' },
			imperial: { 'Con-rod length (centres)': '3.5', Timing: '20' }
		},
		expectKey: 'drop'
	},
	{
		name: 'premix',
		fill: {
			metric: { Fuel: '4', 'Ratio, fuel to oil': '32' },
			imperial: { Fuel: '2' }
		},
		expectKey: 'oil'
	},
	{
		name: 'belt',
		fill: {
			metric: { 'Belt pitch diameter on the variator (drive)': '62', 'Centre distance': '255' },
			imperial: { 'Belt pitch diameter on the clutch pulley (driven)': '4.4' }
		},
		expectKey: 'ratio'
	}
];

for (const c of cases) {
	for (const units of ['metric', 'imperial'] as const) {
		test(`Slide rule ${c.name} (${units}): the page shows what the API computes`, async ({
			page
		}) => {
			await open(page, `/slide-rule/${c.name}`);
			if (units === 'imperial') await page.getByRole('radio', { name: 'Imperial' }).click();
			const before = (await shown(page))[c.expectKey];
			for (const [label, value] of Object.entries(c.fill[units])) {
				await page.getByLabel(label, { exact: false }).first().fill(value);
			}
			await expect.poll(async () => (await shown(page))[c.expectKey]).not.toBe(before);
			await matchesApi(page, c.name);
		});
	}
}

test('a typing mistake is pointed out beside its field and nothing else is lost', async ({
	page
}) => {
	await page.goto('/slide-rule/cylinder');
	await page.getByLabel(/^Stroke/).fill('41');
	await page.getByLabel(/^Bore/).fill('4x');
	await expect(page.getByText('Enter a number.')).toBeVisible();
	await expect(page.getByLabel(/^Bore/)).toHaveAttribute('aria-invalid', 'true');
	await expect(page.getByLabel(/^Stroke/)).toHaveValue('41');
	await page.getByLabel(/^Bore/).fill('47');
	await expect(page.locator('td[data-key="displacement"]')).toHaveText('71.13');
});

test('switching units converts what was typed', async ({ page }) => {
	await page.goto('/slide-rule/gearing');
	await page.getByLabel(/Engine speed at this road speed/).fill('45');
	await page.getByRole('radio', { name: 'Imperial' }).click();
	await expect(page.getByLabel(/Engine speed at this road speed/)).toHaveValue('28');
	await expect(page.locator('td[data-key="topSpeed"]')).toHaveText('68.4');
});

test('the API refuses bad input with named issues', async ({ request }) => {
	const bad = await request.post('/api/slide-rule/cylinder', {
		data: { units: 'metric', bore: -1 },
		headers: { origin }
	});
	expect(bad.status()).toBe(422);
	const body = await bad.json();
	expect(body.issues.map((i: { path: string }) => i.path)).toEqual(
		expect.arrayContaining(['bore', 'stroke'])
	);
	const rod = await request.post('/api/slide-rule/cylinder', {
		data: { units: 'metric', bore: 47, stroke: 39.2, rod: 10, exhaust: 12 },
		headers: { origin }
	});
	expect((await rod.json()).issues[0].path).toBe('rod');
	expect(
		(
			await request.post('/api/slide-rule/flux-capacitor', { data: {}, headers: { origin } })
		).status()
	).toBe(404);
	expect(
		(
			await request.post('/api/slide-rule/gearing', {
				data: Buffer.from('{'),
				headers: { origin, 'content-type': 'application/json' }
			})
		).status()
	).toBe(400);
});

test('the retune for jet 85, step 2, sea level → 1,500 m says 81 and "2 steps leaner"', async ({
	page
}) => {
	await open(page, '/slide-rule/retune');
	await page.getByLabel('Main jet that runs right there').fill('85');
	await page.getByLabel('Step between jet sizes').fill('2');
	for (const [side, elevation] of [
		['Jetted at', '0'],
		['Ridden at', '1500']
	]) {
		await page.getByLabel(`${side}: Elevation`).fill(elevation);
		await page.getByLabel(`${side}: Air temperature`).fill('15');
		await page.getByLabel(`${side}: Relative humidity`).fill('0');
	}
	await expect(page.locator('td[data-key="physicsJet"]')).toHaveText('81');
	await expect(page.locator('td[data-key="physicsSteps"]')).toHaveText('\u22122');
	await expect(page.getByText('Physics: 2 steps leaner, to 81.')).toBeVisible();
	await matchesApi(page, 'retune');
});

test('the retune sheet is shareable and prints on one page', async ({ page, browser }) => {
	await open(page, '/slide-rule/retune');
	await page.getByLabel('Ridden at: Air temperature').fill('2');
	const { onPage } = await matchesApi(page, 'retune');

	const other = await browser.newPage();
	await other.goto(page.url());
	expect(await shown(other)).toEqual(onPage);
	await other.close();

	await page.emulateMedia({ media: 'print' });
	await expect(page.getByRole('form', { name: 'Inputs' })).toBeHidden();
	await expect(page.getByText('Ridden at', { exact: true })).toBeVisible();
	await expect(page.getByRole('heading', { name: 'Before you ride or wrench' })).toBeVisible();
	const pdf = (await page.pdf({ format: 'A4', printBackground: true })).toString('latin1');
	expect(pdf.match(/\/Type\s*\/Page[^s]/g)?.length).toBe(1);
});

test('with JavaScript off a calculator works out on the server, units switch included', async ({
	browser
}) => {
	const context = await browser.newContext({ javaScriptEnabled: false });
	const page = await context.newPage();
	await page.goto('/slide-rule/pipe');
	await page.getByLabel('Exhaust duration').fill('190');
	await page.getByLabel('Engine speed the pipe should work at').fill('10000');
	await page.getByRole('button', { name: 'Work it out' }).click();
	await expect(page).toHaveURL(/exhaustDuration=190/);
	// 190° at 10,000 rpm with 518.16 m/s: 190 · 518.16 / 120,000 m = 820.4 mm (Jennings's formula).
	await expect(page.locator('td[data-key="tunedLength"]')).toHaveText('820');
	await matchesApi(page, 'pipe');
	await page.getByRole('radio', { name: 'Imperial' }).click();
	await expect(page.locator('td[data-key="tunedLength"]')).toHaveText('32.30');
	await expect(page.getByLabel('Exhaust duration')).toHaveValue('190');
	await context.close();
});

test('a member saves the ridden-at place as a card and fills a retune from it', async ({
	page
}) => {
	const me = await makeUser({ password: 'Card-holder-2026' });
	await signInWithPassword(page, me.email, 'Card-holder-2026', '/slide-rule/retune');
	await page.waitForURL(/\/slide-rule\/retune/);
	await open(page, '/slide-rule/retune');
	await page.getByLabel('Ridden at: Elevation').fill('950');
	await page.getByLabel('Ridden at: Air temperature').fill('28');
	await page.getByLabel('Save where it will be ridden as a card named').fill('Hill track, summer');
	await page.getByRole('button', { name: 'Save card' }).last().click();
	await expect(page.getByText('Saved the card “Hill track, summer”.')).toBeVisible();
	await hydrated(page);
	await expect(page.getByLabel('Ridden at: Elevation')).toHaveValue('950');
	await page.getByLabel('Ridden at: Elevation').fill('10');
	await page
		.getByLabel('Fill where it will be ridden from')
		.selectOption({ label: 'Hill track, summer' });
	await expect(page.getByLabel('Ridden at: Elevation')).toHaveValue('950');
	await expect(page.getByLabel('Ridden at: Air temperature')).toHaveValue('28');
	await matchesApi(page, 'retune');
	const list = await page.request.get('/api/riding-conditions');
	expect((await list.json()).cards.map((c: { name: string }) => c.name)).toEqual([
		'Hill track, summer'
	]);
});

test('on a phone the answer stays in sight while typing, far above the results', async ({
	browser
}) => {
	const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
	const page = await context.newPage();
	await open(page, '/slide-rule/gearing');
	const tyre = page.getByLabel(/Rear tyre size/);
	await tyre.scrollIntoViewIfNeeded();
	await tyre.fill('130/60-13 53P');
	const bar = page.getByTestId('summary-bar');
	await expect(bar).toBeInViewport();
	await expect(bar).toContainText('Gearing-limited speed at peak rpm');
	// The bar shows what the table shows, which is off the screen below the form.
	const speed = (await page.locator('td[data-key="topSpeed"]').innerText()).trim();
	await expect(bar).toContainText(speed);
	await expect(page.locator('td[data-key="topSpeed"]')).not.toBeInViewport();
	await context.close();
});

test('without JavaScript a card is saved and then fills the retune with "Use it"', async ({
	browser
}) => {
	const me = await makeUser({ password: 'No-script-card-2026' });
	const context = await browser.newContext({ javaScriptEnabled: false });
	const page = await context.newPage();
	await signInWithPassword(page, me.email, 'No-script-card-2026', '/slide-rule/retune', false);
	await page.waitForURL(/\/slide-rule\/retune/);
	await page.getByLabel('Jetted at: Elevation').fill('1250');
	await page.getByLabel('Save where it was jetted as a card named').fill('Home workshop');
	await page.getByRole('button', { name: 'Save card' }).first().click();
	await expect(page.getByText('Saved the card “Home workshop”.')).toBeVisible();
	await page.getByLabel('Ridden at: Elevation').fill('5');
	await page
		.getByLabel('Fill where it will be ridden from')
		.selectOption({ label: 'Home workshop' });
	await page.getByRole('button', { name: 'Use it' }).last().click();
	await expect(page.getByLabel('Ridden at: Elevation')).toHaveValue('1250');
	await context.close();
});
