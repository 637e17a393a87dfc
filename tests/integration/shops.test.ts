import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { deleteAccount } from '../../src/lib/server/accounts/deletion';
import type { CurrentUser } from '../../src/lib/server/auth/current-user';
import * as builds from '../../src/lib/server/sheet/builds';
import { closeDb, db } from '../../src/lib/server/db/connection';
import { models } from '../../src/lib/server/db/models';
import { createComment } from '../../src/lib/server/comments/comments';
import { fileReport } from '../../src/lib/server/review/reports';
import { deliveredTo } from '../support/mail';
import { addPhoto } from '../../src/lib/server/sheet/photos';
import { decideLink, requestLink } from '../../src/lib/server/shops/links';
import { buildPage } from '../../src/lib/server/pages/build-page';
import { setLogo } from '../../src/lib/server/shops/logo';
import { linkedBuilds, saveShop } from '../../src/lib/server/shops/pages';
import { summarise } from '../../src/lib/shops/summary';
import { acceptHandover, offerHandover } from '../../src/lib/server/shops/transfers';
import { messagesOf, replyToMessage, sendMessage } from '../../src/lib/server/shops/messages';
import { inviteStaff, joinStaff } from '../../src/lib/server/shops/staff';
import { actsFor, setVerified } from '../../src/lib/server/shops/pages';
import { listBuilds } from '../../src/lib/server/search/build-list';
import { buildListSchema } from '../../src/lib/schemas/build-list';
import { objectExists } from '../../src/lib/server/storage/objects';
import { asUser } from '../support/events';
import { anyAddress, makeUser } from '../support/factories';
import { publishedBuild } from '../support/moderation-fixtures';
import { phonePhoto } from '../support/photos';

afterAll(closeDb);

const HOUR = 3600_000;

async function person(role: CurrentUser['role'] = 'member') {
	const u = await makeUser({ role });
	return { ...asUser(u, role), email: u.email };
}

async function newShop(name = 'Fixture Two-Stroke Works') {
	const owner = await person('shop');
	const shop = await saveShop(owner, {
		name,
		region: 'Lowfield',
		services: 'Big-bore kits, porting, jetting',
		openingNote: ''
	});
	return { owner, shop };
}

/** The path and token of the first link in the newest mail to `to` whose text contains `part`. */
async function mailedToken(to: string, part: string): Promise<string> {
	for (let i = 0; i < 50; i++) {
		const mail = (await deliveredTo(to))[0];
		const hit = mail?.text.match(new RegExp(`${part}/([A-Za-z0-9_.-]+)`));
		if (hit) return hit[1];
		await new Promise((r) => setTimeout(r, 100));
	}
	throw new Error(`no mail to ${to} with a ${part} link`);
}

/** Tamper with one character of the signature, keeping the token's shape. */
const forge = (token: string) => token.slice(0, -1) + (token.endsWith('A') ? 'B' : 'A');

describe('shop links: signed, single-use, one-day tokens', () => {
	it('approves by the mailed link once; a forged, expired or reused link changes nothing', async () => {
		const { owner: shopOwner, shop } = await newShop();
		const member = await person();
		const { build } = await publishedBuild(member.id, 'Link token fixture');
		const now = new Date();
		const l = await requestLink(
			shopOwner,
			shop,
			{ buildId: build.id, kind: 'tuned', note: '' },
			now
		);
		const approve = await mailedToken(member.email, '/links');
		const state = async () => (await models().ShopLink.findByPk(l.id))!.state;

		expect(await decideLink({ token: forge(approve) }, null, now)).toEqual({
			ok: false,
			problem: 'forged'
		});
		expect(await decideLink({ token: approve }, null, new Date(now.getTime() + 25 * HOUR))).toEqual(
			{ ok: false, problem: 'expired' }
		);
		expect(await state()).toBe('requested');

		// Just inside the day it still works, once.
		const r = await decideLink({ token: approve }, null, new Date(now.getTime() + 23 * HOUR));
		expect(r.ok).toBe(true);
		expect(await state()).toBe('approved');
		expect(await decideLink({ token: approve }, null, now)).toEqual({ ok: false, problem: 'used' });
		expect(
			(await buildPage(build, null, 'metric', new Date())).shops.map((x) => x.shopName)
		).toEqual([shop.name]);

		const summary = summarise(await linkedBuilds(shop.id));
		expect(summary.builds).toBe(1);

		// The list shows the stamp only once an admin verified the shop.
		const stamped = async () =>
			(
				await listBuilds(buildListSchema.parse({ q: 'Link token fixture', limit: 50 }), 'metric')
			).builds.find((x) => x.id === build.id)?.verifiedShop;
		expect(await stamped()).toBeNull();
		await setVerified(await person('admin'), shop.id, true, 'checked', now);
		expect(await stamped()).toBe(shop.name); // the stamp names whose work it vouches for
	});

	it('a token made for another purpose does not pass as a link decision', async () => {
		const { owner, shop } = await newShop('Purpose Check Garage');
		const customer = await person();
		const draft = await builds.create(owner.id, { title: 'Purpose fixture' });
		await offerHandover(owner, shop, { buildId: draft.id, email: customer.email }, new Date());
		const handoverToken = await mailedToken(customer.email, '/handover');
		expect(await decideLink({ token: handoverToken }, null, new Date())).toEqual({
			ok: false,
			problem: 'forged'
		});
	});
});

describe('handing a build to a customer', () => {
	it('stays the shop’s until the customer accepts; then it is theirs, once', async () => {
		const { owner, shop } = await newShop('Handover Works');
		const customer = await person();
		const stranger = await person();
		const draft = await builds.create(owner.id, { title: 'Customer scooter' });
		const now = new Date();
		await offerHandover(owner, shop, { buildId: draft.id, email: customer.email }, now);
		const token = await mailedToken(customer.email, '/handover');

		expect(await acceptHandover(customer, { token: forge(token) }, now)).toEqual({
			ok: false,
			problem: 'forged'
		});
		expect(await acceptHandover(customer, { token }, new Date(now.getTime() + 25 * HOUR))).toEqual({
			ok: false,
			problem: 'expired'
		});
		// Another account cannot take it, even holding the link.
		await expect(acceptHandover(stranger, { token }, now)).rejects.toMatchObject({ status: 403 });
		expect((await builds.read(draft.id))!.ownerId).toBe(owner.id);

		const r = await acceptHandover(customer, { token }, now);
		expect(r.ok).toBe(true);
		const after = (await builds.read(draft.id))!;
		expect(after.ownerId).toBe(customer.id);
		expect(after.publication).toBe('draft');
		const credit = await models().ShopLink.findOne({ where: { buildId: draft.id } });
		expect(credit?.state).toBe('approved');
		expect(credit?.kind).toBe('built');
		expect((await acceptHandover(customer, { token }, now)).ok).toBe(false);
	});
});

describe('writing to a shop', () => {
	it('hides the sender’s address from the shop until it replies through the app', async () => {
		const { owner, shop } = await newShop('Quiet Counter');
		const member = await person();
		const now = new Date();
		await sendMessage(member, shop, 'Can you port a 70 cc kit?', '10.6.0.1', now);
		const inbox = await deliveredTo(owner.email);
		expect(inbox[0].subject).toContain('A message for Quiet Counter');
		expect(inbox[0].text).toContain('Can you port a 70 cc kit?');
		expect(inbox[0].text + inbox[0].html).not.toContain(member.email);
		const [m] = await messagesOf(shop.id);
		expect(m.fromEmail).toBeNull();

		await replyToMessage(owner, shop, m.id, 'Yes, bring the cases on Saturday.', now);
		const answer = (await deliveredTo(member.email))[0];
		expect(answer.text).toContain('Yes, bring the cases on Saturday.');
		expect(answer.text).toContain(owner.email);
		expect((await messagesOf(shop.id))[0].fromEmail).toBe(member.email);
		await expect(replyToMessage(owner, shop, m.id, 'Again', now)).rejects.toMatchObject({
			status: 409
		});
	});

	it('limits messages per account, with the wait in words', async () => {
		const { shop } = await newShop('Busy Counter');
		const member = await person();
		const send = (i: number) =>
			sendMessage(member, shop, `Message ${i}`, `10.5.${i}.1`, new Date());
		// messagesByAccount: 5 an hour (src/lib/server/auth/limits.ts).
		for (let i = 0; i < 5; i++) await send(i);
		await expect(send(5)).rejects.toMatchObject({ status: 429 });
		await expect(send(6)).rejects.toThrow(/Try again in/);
	});
});

describe('shop staff', () => {
	it('joins by the mailed link only as the invited address, once', async () => {
		const { owner, shop } = await newShop('Staffed Works');
		const invited = await person();
		const other = await person();
		const now = new Date();
		await inviteStaff(owner, shop, invited.email, now);
		const token = await mailedToken(invited.email, '/staff');
		expect(await joinStaff(invited, forge(token), now)).toEqual({ ok: false, problem: 'forged' });
		await expect(joinStaff(other, token, now)).rejects.toMatchObject({ status: 403 });
		expect(await actsFor(invited, shop)).toBe(false);
		expect(await joinStaff(invited, token, now)).toEqual({ ok: true, shopName: 'Staffed Works' });
		expect(await actsFor(invited, shop)).toBe(true);
		expect(await joinStaff(invited, token, now)).toEqual({ ok: false, problem: 'used' });

		// Staff hand over a sheet they filled in for the shop; an outsider's sheet cannot be offered.
		const customer = await person();
		const sheet = await builds.create(invited.id, { title: 'Filled in by staff' });
		await offerHandover(invited, shop, { buildId: sheet.id, email: customer.email }, now);
		const outsider = await builds.create(other.id, { title: 'Not the shop’s' });
		await expect(
			offerHandover(invited, shop, { buildId: outsider.id, email: customer.email }, now)
		).rejects.toMatchObject({ status: 404 });
		const accept = await mailedToken(customer.email, '/handover');
		expect((await acceptHandover(customer, { token: accept }, now)).ok).toBe(true);
		expect((await builds.read(sheet.id))!.ownerId).toBe(customer.id);
	});
});

/** Rows anywhere that still point at the given builds, setups, comments, shops or account. */
async function leftovers(ids: {
	builds: number[];
	setups: number[];
	comments: number[];
	shops: number[];
	userId: string;
}) {
	const q = (sql: string, replacements: Record<string, unknown>) =>
		db()
			.query<{ n: number }>(sql, { type: QueryTypes.SELECT, replacements })
			.then((r) => Number(r[0].n));
	const list = (xs: number[]) => (xs.length ? xs : [0]);
	const counts: Record<string, number> = {};
	for (const t of ['setups', 'parts', 'photos', 'comments', 'shop_links', 'build_transfers'])
		counts[t] = await q(`SELECT COUNT(*) AS n FROM ${t} WHERE build_id IN (:b)`, {
			b: list(ids.builds)
		});
	counts.runs = await q('SELECT COUNT(*) AS n FROM runs WHERE setup_id IN (:s)', {
		s: list(ids.setups)
	});
	for (const t of ['reports', 'flags', 'review_cases'])
		counts[t] = await q(
			`SELECT COUNT(*) AS n FROM ${t} WHERE (item_type = 'build' AND item_id IN (:b))
			 OR (item_type = 'setup' AND item_id IN (:s)) OR (item_type = 'comment' AND item_id IN (:c))
			 OR (item_type = 'shop' AND item_id IN (:h))`,
			{
				b: list(ids.builds),
				s: list(ids.setups),
				c: list(ids.comments),
				h: list(ids.shops)
			}
		);
	counts.shops = await q('SELECT COUNT(*) AS n FROM shops WHERE id IN (:h)', {
		h: list(ids.shops)
	});
	counts.userRefs = await q(
		`SELECT (SELECT COUNT(*) FROM users WHERE id = :u) + (SELECT COUNT(*) FROM accounts WHERE user_id = :u)
		 + (SELECT COUNT(*) FROM reports WHERE reporter_id = :u) + (SELECT COUNT(*) FROM review_cases WHERE author_id = :u)
		 + (SELECT COUNT(*) FROM comments WHERE author_id = :u) + (SELECT COUNT(*) FROM shop_messages WHERE sender_id = :u)
		 + (SELECT COUNT(*) FROM builds WHERE owner_id = :u) AS n`,
		{ u: ids.userId }
	);
	return counts;
}

/** A shop account with one published build holding a photo, a reported comment and a logo. */
async function busyAccount() {
	const { owner, shop } = await newShop('Leaving Garage');
	const { build, setupId } = await publishedBuild(owner.id, 'Leaving build');
	const photo = await addPhoto(build.id, await phonePhoto());
	await setLogo(shop, await phonePhoto());
	const logoKey = (await models().Shop.findByPk(shop.id))!.logoKey!;
	const other = await person();
	const { build: theirs } = await publishedBuild(other.id, 'Someone else’s build');
	const mine = await createComment(owner, theirs, { body: 'Nice pipe.' }, '10.8.0.1', new Date());
	const onMine = await createComment(
		other,
		build,
		{ body: 'What squish?' },
		'10.8.0.2',
		new Date()
	);
	await fileReport(
		other,
		{ type: 'build', id: build.id },
		{ reason: 'spam', note: '' },
		new Date(),
		anyAddress()
	);
	await fileReport(
		owner,
		{ type: 'build', id: theirs.id },
		{ reason: 'spam', note: '' },
		new Date(),
		anyAddress()
	);
	return { owner, shop, build, setupId, photo, logoKey, mine, onMine, theirs };
}

describe('deleting an account', () => {
	it('is refused to the only admin, and nothing is removed', async () => {
		const { User } = models();
		const admins = await User.findAll({ where: { role: 'admin' } });
		// Make this the only admin for the check, then give the others their role back.
		const only = await person('admin');
		await User.update({ role: 'member' }, { where: { id: admins.map((a) => a.id) } });
		try {
			await expect(deleteAccount(only, 'delete-builds', new Date())).rejects.toMatchObject({
				status: 409
			});
			expect(await User.findByPk(only.id)).not.toBeNull();
		} finally {
			await User.update({ role: 'admin' }, { where: { id: admins.map((a) => a.id) } });
		}
		await deleteAccount(only, 'delete-builds', new Date());
		expect(await User.findByPk(only.id)).toBeNull();
	});

	it('with its builds: no rows or objects are left behind', async () => {
		const a = await busyAccount();
		await deleteAccount(a.owner, 'delete-builds', new Date());
		const left = await leftovers({
			builds: [a.build.id],
			setups: [a.setupId],
			comments: [a.onMine.id],
			shops: [a.shop.id],
			userId: a.owner.id
		});
		expect(left).toEqual({
			setups: 0,
			parts: 0,
			photos: 0,
			comments: 0,
			shop_links: 0,
			build_transfers: 0,
			runs: 0,
			reports: 0,
			flags: 0,
			review_cases: 0,
			shops: 0,
			userRefs: 0
		});
		expect(await builds.read(a.build.id)).toBeNull();
		expect(await objectExists(a.photo.displayKey)).toBe(false);
		expect(await objectExists(a.photo.thumbKey)).toBe(false);
		expect(await objectExists(a.logoKey)).toBe(false);
		// Their comment elsewhere stays, unsigned, so the thread keeps its sense.
		const kept = await models().Comment.findByPk(a.mine.id);
		expect(kept?.authorId).toBeNull();
	});

	it('keeping the builds anonymised: the published sheet and its photo stay, with no owner; drafts go', async () => {
		const a = await busyAccount();
		const draft = await builds.create(a.owner.id, { title: 'Unfinished draft' });
		await deleteAccount(a.owner, 'keep-anonymised', new Date());
		expect(await builds.read(draft.id)).toBeNull();
		const b = await builds.read(a.build.id);
		expect(b?.ownerId).toBeNull();
		expect(b?.publication).toBe('published');
		expect(await objectExists(a.photo.displayKey)).toBe(true);
		expect(await objectExists(a.logoKey)).toBe(false);
		const left = await leftovers({
			builds: [],
			setups: [],
			comments: [],
			shops: [a.shop.id],
			userId: a.owner.id
		});
		expect(left.userRefs).toBe(0);
		expect(left.shops).toBe(0);
		expect(left.reports).toBe(0);
	});
});
