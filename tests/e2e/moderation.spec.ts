import { expect, test, type Browser, type Page } from '@playwright/test';
import { publishedBuild } from '../support/moderation-fixtures';
import { makeUser, open, openNewestMail, signInWithPassword } from './support';

// The whole path of one unsafe comment through the review desk, each person in their own browser.

async function as(browser: Browser, who: { email: string; password: string }): Promise<Page> {
	const page = await (await browser.newContext()).newPage();
	await signInWithPassword(page, who.email, who.password);
	await expect(page.getByRole('banner')).toContainText('Sign out');
	return page;
}

/** The desk's card for the comment, found by the build's unique title. */
const caseCard = (page: Page, title: string) =>
	page
		.getByRole('article')
		.filter({ has: page.getByRole('link', { name: `comment on “${title}”` }) });

test('a reported comment is triaged, taken down, changed, looked at again and put back; the log has it all', async ({
	browser
}) => {
	test.setTimeout(90_000);
	const author = await makeUser();
	const reporter = await makeUser();
	const moderator = await makeUser({ role: 'moderator' });
	const title = `Desk flow ${Date.now()}`;
	const { build } = await publishedBuild(author.id, title);

	// The author gives advice the desk will not keep.
	const a = await as(browser, author);
	await open(a, `/builds/${build.id}#comments`);
	await a.getByLabel(/Your comment/).fill('Unbolt the front caliper, it only costs you top speed.');
	await a.getByRole('button', { name: 'Post the comment' }).click();
	const mine = a.getByRole('article', { name: /Comment by/ }).first();
	await expect(mine).toContainText('Unbolt the front caliper');
	const commentId = (await mine.getAttribute('id'))!.replace('comment-', '');

	// Another member reports it as unsafe.
	const r = await as(browser, reporter);
	await open(r, `/builds/${build.id}#comments`);
	await r
		.locator(`#comment-${commentId}`)
		.getByRole('link', { name: /Report/ })
		.click();
	await expect(r.getByRole('heading', { name: 'Report a comment' })).toBeVisible();
	await r.getByLabel('Unsafe advice').check();
	await r
		.getByLabel('A note for the review desk')
		.fill('Tells people to ride without a front brake.');
	await r.getByRole('button', { name: 'Send the report' }).click();
	await expect(r.getByText(/Thank/)).toBeVisible();

	// The moderator triages it, then takes it down with a reason.
	const m = await as(browser, moderator);
	await open(m, '/review?order=newest');
	let card = caseCard(m, title);
	await expect(card).toContainText('Tells people to ride without a front brake.');
	await card.getByRole('button', { name: 'Triage as a concern' }).click();
	await expect(card).toContainText('triaged as a concern');
	await card.getByLabel('Reason').fill('advice to ride without a front brake');
	// Enter in the reason field picks no action: nothing happens until a button is pressed.
	await card.getByLabel('Reason').press('Enter');
	await expect(card).toContainText('triaged as a concern');
	// Taking down asks once more; the first answer here is no.
	m.once('dialog', (d) => void d.dismiss());
	await card.getByRole('button', { name: 'Take down…' }).click();
	await expect(card).toBeVisible();
	m.once('dialog', (d) => void d.accept());
	await card.getByRole('button', { name: 'Take down…' }).click();
	await expect(card).toHaveCount(0);

	// Readers see the reason in place of the words.
	await open(r, `/builds/${build.id}?after=hide`);
	const shown = r.locator(`#comment-${commentId}`);
	await expect(shown).toContainText(
		'Taken down by the review desk: advice to ride without a front brake'
	);
	await expect(shown).not.toContainText('Unbolt the front caliper');

	// The author has the decision by mail, changes the comment and asks once for another look.
	const mail = await (await browser.newContext()).newPage();
	await openNewestMail(mail, author.email, /Review desk: .*comment on/);
	await expect(mail.locator('main')).toContainText('advice to ride without a front brake');
	await open(a, `/builds/${build.id}#comments`);
	const hidden = a.locator(`#comment-${commentId}`);
	await hidden.getByText('Change', { exact: true }).click();
	await hidden
		.getByLabel('Your comment (Markdown)')
		.fill('Check the front caliper bolts are torqued to spec before every run.');
	await hidden.getByRole('button', { name: 'Save the change' }).click();
	await expect(hidden).toContainText('torqued to spec');
	await hidden.getByRole('button', { name: 'Ask for another look' }).click();
	await expect(hidden).toContainText('You asked for another look');

	// The moderator puts it back.
	await open(m, '/review?order=newest');
	card = caseCard(m, title);
	await expect(card).toContainText('asks for another look');
	await card.getByLabel('Reason').fill('changed to safe advice');
	await card.getByRole('button', { name: 'Put back' }).click();
	await expect(card).toHaveCount(0);
	await open(r, `/builds/${build.id}?after=restore`);
	await expect(r.locator(`#comment-${commentId}`)).toContainText('torqued to spec');

	// The log holds the four steps in the order they happened.
	await open(m, `/review/log?itemType=comment&itemId=${commentId}&order=oldest`);
	const actions = await m
		.getByTestId('log-row')
		.locator('td[data-action]')
		.evaluateAll((tds) => tds.map((td) => td.getAttribute('data-action')));
	expect(actions).toEqual(['triage', 'hide', 'second-look', 'restore']);
});

test('a moderator puts back a build taken down by mistake, from the log, with a reason', async ({
	browser
}) => {
	const author = await makeUser();
	const moderator = await makeUser({ role: 'moderator' });
	const reporter = await makeUser();
	const title = `Put back ${Date.now()}`;
	const { build } = await publishedBuild(author.id, title);
	const r = await as(browser, reporter);
	await open(r, `/report?type=build&id=${build.id}`);
	await r.getByLabel('Wrong or made-up figures').check();
	await r.getByRole('button', { name: 'Send the report' }).click();
	await expect(r.getByText(/Thank/)).toBeVisible();

	const m = await as(browser, moderator);
	await open(m, '/review?order=newest');
	const card = m
		.getByRole('article')
		.filter({ has: m.getByRole('link', { name: title, exact: true }) });
	await card.getByLabel('Reason').fill('figures copied from another sheet');
	m.once('dialog', (d) => void d.accept());
	await card.getByRole('button', { name: 'Take down…' }).click();
	await expect(card).toHaveCount(0);

	// No case is open any more: the way back is the log, then the item's own desk page.
	await open(m, `/review/log?itemType=build&itemId=${build.id}`);
	await m
		.getByRole('link', { name: `build ${build.id}` })
		.first()
		.click();
	await expect(m.getByRole('heading', { level: 1 })).toHaveText(title);
	await expect(m.getByText('figures copied from another sheet').first()).toBeVisible();
	await m.getByRole('button', { name: 'Put back' }).click();
	await expect(m.getByRole('alert')).toContainText('Say why it goes back up');
	await m.getByLabel('Why it goes back up').fill('the owner sent the logger files');
	await m.getByRole('button', { name: 'Put back' }).click();
	await expect(m.getByText('Put back. Logged and mailed to the author.')).toBeVisible();
	await expect(
		m.getByRole('listitem').filter({ hasText: 'the owner sent the logger files' })
	).toHaveCount(1);

	await open(r, `/builds/${build.id}?after=put-back`);
	await expect(r.getByRole('heading', { level: 1 })).toHaveText(title);
});
