import { expect, test } from '@playwright/test';
import { publishedBuild } from '../support/moderation-fixtures';
import { makeUser, open, signInWithPassword } from './support';

test('the report form starts with nothing chosen, and a second report adds to the first', async ({
	page
}) => {
	const owner = await makeUser();
	const reporter = await makeUser();
	const { build } = await publishedBuild(owner.id, `Report form ${Date.now()}`);
	await signInWithPassword(page, reporter.email, reporter.password);
	await expect(page.getByRole('banner')).toContainText('Sign out');

	await open(page, `/report?type=build&id=${build.id}`);
	const reasons = page.getByRole('group', { name: 'What is wrong with it?' });
	for (const radio of await reasons.getByRole('radio').all()) await expect(radio).not.toBeChecked();
	// One careless tap on Send files nothing.
	await page.getByRole('button', { name: 'Send the report' }).click();
	await expect(page.getByText('Pick what is wrong with it.')).toBeVisible();

	await page.getByLabel('Unsafe advice').check();
	await page.getByRole('button', { name: 'Send the report' }).click();
	await expect(page.getByText(/Thank you. The review desk will look at it/)).toBeVisible();

	// The real report, with a note, is added to the first instead of refused.
	await open(page, `/report?type=build&id=${build.id}`);
	await page.getByLabel('Wrong or made-up figures').check();
	await page.getByLabel('A note for the review desk').fill('The jet size is for another carb.');
	await page.getByRole('button', { name: 'Send the report' }).click();
	await expect(page.getByText(/added this to your earlier report/)).toBeVisible();
});
