import { expect, test } from '@playwright/test';
import * as builds from '../../src/lib/server/sheet/builds';
import { saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { setPublication } from '../../src/lib/server/sheet/build-service';
import { FIXTURE_SETUP, fixtureRun } from '../support/sheet-fixtures';
import { makeUser, signInWithPassword } from './support';

test('a setup card reads as words: a space around "·", and no two-way legend without a two-way run', async ({
	page
}) => {
	const owner = await makeUser();
	const b = await builds.create(owner.id, {
		title: `One-way runs ${Date.now()}`,
		chassis: 'Test frame',
		engineFamily: 'fixture family'
	});
	const s = (await saveSetup(b.id, { ...FIXTURE_SETUP, isStock: true, changeNote: 'Stock' })) as {
		id: number;
	};
	await saveRun(b.id, s.id, { ...fixtureRun(50.7), twoWay: false });
	await setPublication((await builds.read(b.id))!, 'published');

	await page.goto(`/builds/${b.id}`);
	const card = page.getByRole('article', { name: /1\. Stock/ });
	await expect(card).toContainText(/stock baseline · best 50\.7 km\/h/);
	await expect(card).not.toContainText('two-way average');

	// The units switch with its warning reads "imperial (unsaved …", not "imperial(unsaved".
	await signInWithPassword(page, owner.email, owner.password, '/builds/new');
	await page.waitForURL('**/builds/new');
	await expect(page.getByText(/Showing/)).toContainText(
		'switch to imperial (what you typed is kept and converted)'
	);
});
