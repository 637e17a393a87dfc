import { expect, test, type Page } from '@playwright/test';
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
			metric: { 'Main jet that runs right there': '100', 'Target: Elevation': '1800' },
			imperial: { 'Tuned at: Elevation': '300', 'Target: Elevation': '7000' }
		},
		expectKey: 'physicsJet'
	}
];

for (const c of cases) {
	for (const units of ['metric', 'imperial'] as const) {
		test(`Slide rule ${c.name} (${units}): the page shows what the API computes`, async ({
			page
		}) => {
			await page.goto(`/slide-rule/${c.name}`);
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

test('the retune sheet is shareable and prints on one page', async ({ page, browser }) => {
	await page.goto('/slide-rule/retune');
	await page.getByRole('button', { name: 'winter' }).click();
	await expect(page.getByLabel('Target: Air temperature')).toHaveValue('2');
	const { onPage } = await matchesApi(page, 'retune');

	const other = await browser.newPage();
	await other.goto(page.url());
	expect(await shown(other)).toEqual(onPage);
	await other.close();

	await page.emulateMedia({ media: 'print' });
	await expect(page.getByRole('form', { name: 'Inputs' })).toBeHidden();
	await expect(page.getByText('Will run at')).toBeVisible();
	await expect(page.getByRole('heading', { name: 'Before you ride or wrench' })).toBeVisible();
	const pdf = (await page.pdf({ format: 'A4', printBackground: true })).toString('latin1');
	expect(pdf.match(/\/Type\s*\/Page[^s]/g)?.length).toBe(1);
});
