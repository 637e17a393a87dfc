import { afterAll, describe, expect, it, vi } from 'vitest';
import { closeDb, db } from '../../src/lib/server/db/connection';
import { models } from '../../src/lib/server/db/models';
import { createComment } from '../../src/lib/server/comments/comments';
import { saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import * as builds from '../../src/lib/server/sheet/builds';
import type { buildPage } from '../../src/lib/server/pages/build-page';
import { load } from '../../src/routes/builds/[id=id]/+page.server';
import { asUser, fakeEvent } from '../support/events';
import { makeUser } from '../support/factories';
import { publishedBuild } from '../support/moderation-fixtures';
import { FIXTURE_SETUP, fixtureRun } from '../support/sheet-fixtures';

type PageData = Awaited<ReturnType<typeof buildPage>>;

afterAll(closeDb);

/** The page's load as `user` would get it, with every SQL statement it sent. */
async function opened(buildId: number, user: ReturnType<typeof asUser> | null) {
	const spy = vi.spyOn(db(), 'query');
	try {
		const data = (await load(
			fakeEvent({ user, params: { id: String(buildId) }, path: `/builds/${buildId}` })
		)) as PageData;
		return { data, sql: spy.mock.calls.map((c) => String(c[0])) };
	} finally {
		spy.mockRestore();
	}
}

describe('the build page', () => {
	it('reads in the same few queries with one setup or five, comments, links and desk cases', async () => {
		const ownerAccount = await makeUser();
		const owner = asUser(ownerAccount);
		const reader = asUser(await makeUser());
		const { build, setupId } = await publishedBuild(owner.id, 'Query count fixture');

		const small = { reader: await opened(build.id, reader), owner: await opened(build.id, owner) };
		expect(small.reader.data.setups).toHaveLength(1);

		// Four more setups, each with two runs; comments by both; a shop named on it and one
		// asking; the desk's caution on one setup.
		let prev = setupId;
		for (let i = 0; i < 4; i++) {
			const s = (await saveSetup(build.id, {
				...FIXTURE_SETUP,
				mainJet: 94 + 2 * i,
				changeNote: `Jet ${94 + 2 * i}`
			})) as { id: number };
			await saveRun(build.id, s.id, fixtureRun(71 + i));
			await saveRun(build.id, s.id, fixtureRun(70 + i));
			prev = s.id;
		}
		const fresh = (await builds.read(build.id))!;
		for (let i = 0; i < 3; i++) {
			await createComment(reader, fresh, { body: `Reader asks ${i}` }, `10.7.0.${i}`, new Date());
			await createComment(owner, fresh, { body: `Owner answers ${i}` }, `10.7.1.${i}`, new Date());
		}
		const { Shop, ShopLink, ReviewCase } = models();
		const shopOwner = await makeUser({ role: 'shop' });
		const named = await Shop.create({
			ownerId: shopOwner.id,
			name: 'Query Count Works',
			services: ''
		});
		const asking = await Shop.create({
			ownerId: (await makeUser({ role: 'shop' })).id,
			name: 'Query Count Asks',
			services: ''
		});
		await ShopLink.create({
			buildId: build.id,
			shopId: named.id,
			kind: 'built',
			state: 'approved'
		});
		await ShopLink.create({
			buildId: build.id,
			shopId: asking.id,
			kind: 'tuned',
			state: 'requested'
		});
		const now = new Date();
		await ReviewCase.create({
			itemType: 'setup',
			itemId: prev,
			authorId: owner.id,
			caution: true,
			openedAt: now,
			updatedAt: now
		});

		const big = { reader: await opened(build.id, reader), owner: await opened(build.id, owner) };
		const anonymous = await opened(build.id, null);

		// The build row, then one SELECT for everything else (the session's own lookup of a
		// signed-in reader happens before the load, in hooks, and is the owner's fourth).
		for (const v of [small.reader, small.owner, big.reader, big.owner, anonymous])
			expect(v.sql).toHaveLength(2);
		// A name is shown, never read with the rest of a user row (its password hash included).
		for (const v of [big.reader, big.owner]) expect(v.sql.join('\n')).not.toMatch(/password/i);

		const r = big.reader.data;
		expect(r.setups.map((s) => s.position)).toEqual([1, 2, 3, 4, 5]);
		expect(r.setups[4].runs).toHaveLength(2);
		expect(r.setups[4].best?.speedKmh).toBe(74);
		expect(r.steps).toHaveLength(4);
		expect(r.build.ownerName).toMatch(/^Tester /);
		expect(r.comments).toHaveLength(6);
		expect(r.comments.filter((c) => c.mine)).toHaveLength(3);
		expect(r.comments[0].author).toMatch(/^Tester /);
		expect(r.shops.map((s) => s.shopName)).toEqual(['Query Count Works']);
		expect(r.pendingShops).toEqual([]);
		expect(r.standing.setupCautions).toEqual([prev]);
		expect(r.mine).toBe(false);

		const o = big.owner.data;
		expect(o.mine).toBe(true);
		expect(o.pendingShops.map((s) => s.shopName)).toEqual(['Query Count Asks']);
		expect(o.comments.filter((c) => c.mine && c.canEdit)).toHaveLength(3);
		expect(o.standing.setupSecondLook[prev]).toBe('none');

		// The runs read back through JSON match what Sequelize reads, value for value and type.
		const direct = await models().Run.findAll({
			where: { buildId: build.id },
			order: [
				['runOn', 'ASC'],
				['id', 'ASC']
			]
		});
		expect(o.setups.flatMap((s) => s.runs).sort((a, b) => a.id - b.id)).toEqual(
			direct.map((x) => x.get({ plain: true })).sort((a, b) => a.id - b.id)
		);
	});
});
