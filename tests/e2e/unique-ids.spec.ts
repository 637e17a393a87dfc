import { expect, test } from '@playwright/test';
import { models } from '../../src/lib/server/db/models';
import { publishedBuild } from '../support/moderation-fixtures';
import { makeUser, open, signInWithPassword } from './support';

// A label points at one element by id: a repeated id sends it (and screen readers) elsewhere.
// HTML requires ids to be unique in a document (https://html.spec.whatwg.org/#the-id-attribute).
test('no page repeats an id, the forms with sections included', async ({ page }) => {
	test.setTimeout(90_000);
	const owner = await makeUser();
	const { build, setupId } = await publishedBuild(owner.id, `Unique ids ${Date.now()}`);
	const run = await models().Run.findOne({ where: { setupId } });
	await signInWithPassword(page, owner.email, owner.password);
	await expect(page.getByRole('banner')).toContainText('Sign out');
	const pages = [
		'/',
		'/builds',
		'/builds?view=table',
		`/builds/${build.id}`,
		`/builds/${build.id}/edit`,
		`/builds/${build.id}/setups/new`,
		`/builds/${build.id}/setups/${setupId}/edit`,
		`/builds/${build.id}/setups/${setupId}/runs/new`,
		`/builds/${build.id}/runs/${run!.id}/edit`,
		'/builds/new',
		'/bench',
		'/profile',
		'/close',
		'/speed-map',
		'/change-effects',
		'/slide-rule',
		'/shops',
		`/report?type=build&id=${build.id}`
	];
	const repeated: Record<string, string[]> = {};
	for (const path of pages) {
		await open(page, path);
		const ids = await page.evaluate(() => [...document.querySelectorAll('[id]')].map((e) => e.id));
		const twice = [...new Set(ids.filter((id, i) => ids.indexOf(id) !== i))];
		if (twice.length) repeated[path] = twice;
	}
	expect(repeated).toEqual({});
	// And the story's label now reaches its box.
	await open(page, `/builds/${build.id}/edit`);
	await page.getByLabel('The story (Markdown)').fill('Kit on, squish 0.9 mm.');
	await expect(page.getByRole('textbox', { name: 'The story (Markdown)' })).toHaveValue(
		'Kit on, squish 0.9 mm.'
	);
});
