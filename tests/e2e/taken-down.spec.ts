import { expect, test } from '@playwright/test';
import type { CurrentUser } from '../../src/lib/server/auth/current-user';
import { models } from '../../src/lib/server/db/models';
import { decide } from '../../src/lib/server/review/desk';
import { fileReport } from '../../src/lib/server/review/reports';
import { publishedBuild } from '../support/moderation-fixtures';
import { makeUser } from './support';

const asCurrent = (id: string, role: CurrentUser['role']): CurrentUser => ({
	id,
	email: `${id}@tests.squishline.test`,
	name: 'Tester',
	role,
	units: 'metric',
	theme: 'device',
	suspension: null
});

test('a reader of a build the desk took down sees the public reason, not a bare "not found"', async ({
	page,
	request
}) => {
	const owner = await makeUser();
	const { build } = await publishedBuild(owner.id, `Taken down ${Date.now()}`);
	// Taken down the way the desk does it, so every listing forgets it too.
	const ref = { type: 'build' as const, id: build.id };
	const reporter = await makeUser();
	const mod = await makeUser({ role: 'moderator' });
	const now = new Date();
	await fileReport(
		asCurrent(reporter.id, 'member'),
		ref,
		{ reason: 'unsafe', note: '' },
		now,
		'127.0.0.1'
	);
	const kase = await models().ReviewCase.findOne({
		where: { itemType: 'build', itemId: build.id }
	});
	await decide(
		asCurrent(mod.id, 'moderator'),
		kase!.id,
		{ action: 'hide', reason: 'advice to ride without a rear brake.' },
		now
	);
	const res = await page.goto(`/builds/${build.id}`);
	expect(res?.status()).toBe(410);
	await expect(page.getByRole('heading', { level: 1 })).toHaveText('Taken down');
	await expect(
		page.getByText('Taken down by the review desk: advice to ride without a rear brake.', {
			exact: true
		})
	).toBeVisible();
	const api = await request.get(`/api/builds/${build.id}`);
	expect(api.status()).toBe(410);
	expect((await api.json()).error).toContain('advice to ride without a rear brake.');
});
