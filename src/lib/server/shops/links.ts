import { Failure } from '../../failure';
import type { CurrentUser } from '../auth/current-user';
import { models, type Shop, type ShopLink } from '../db/models';
import * as builds from '../sheet/builds';
import * as users from '../auth/users';
import { send } from '../mail/send';
import * as log from '../review/log';
import { linkRequest } from './letters';
import { checkToken, makeToken, type Checked } from './tokens';
import { inTransaction } from '../db/transaction';
import { nestedRows } from '../db/nested';

export type LinkDecision = 'approve' | 'decline';

/**
 * A build's links in one state, with the shop's name and stamp, as one column of the build page's
 * SELECT (db/nested.ts; `buildId`). Approved links show only shops the desk has not taken down.
 */
export function linksColumn(state: 'approved' | 'requested') {
	const approved = state === 'approved';
	return nestedRows(models().ShopLink, {
		alias: 'l',
		join: `JOIN shops sh ON sh.id = l.shop_id${approved ? " AND sh.moderation = 'visible'" : ''}`,
		extra: ['sh.name', 'sh.verified_at IS NOT NULL'],
		where: `l.build_id = :buildId AND l.state = '${state}'`,
		order: approved ? 'l.decided_at, l.id' : 'l.created_at, l.id'
	});
}

type LinkRows = ReturnType<ReturnType<typeof linksColumn>['read']>;

/** Links as the build page shows them; a request's note is for the build's owner only. */
export const linkViews = ({ rows, extras }: LinkRows, withNote = false) =>
	rows.map((l, i) => ({
		id: l.id,
		kind: l.kind,
		shopId: l.shopId,
		shopName: extras[i][0] as string,
		verified: Boolean(extras[i][1]),
		note: withNote ? l.note : ''
	}));

/** A shop's links in every state, newest first, for its own page of requests. */
export async function linksOfShop(shopId: number) {
	const { ShopLink, Build } = models();
	const rows = await ShopLink.findAll({ where: { shopId }, order: [['id', 'DESC']], limit: 200 });
	const titles = new Map(
		(
			await Build.findAll({
				where: { id: [...new Set(rows.map((r) => r.buildId))] },
				attributes: ['id', 'title']
			})
		).map((b) => [b.id, b.title])
	);
	return rows.map((l) => ({
		id: l.id,
		buildId: l.buildId,
		buildTitle: titles.get(l.buildId) ?? '(gone)',
		kind: l.kind,
		state: l.state
	}));
}

/**
 * A shop asks to be named on a published build (or one of its owner's own drafts). One open or
 * approved link per shop and build; the owner is mailed approve and decline links.
 */
export async function requestLink(
	me: CurrentUser,
	shop: Shop,
	input: { buildId: number; kind: 'built' | 'tuned'; note: string },
	now: Date
): Promise<ShopLink> {
	return inTransaction(async () => {
		const { ShopLink } = models();
		const b = await builds.read(input.buildId);
		const visible = b && b.publication === 'published' && b.moderation === 'visible';
		if (!b || (!visible && b.ownerId !== me.id)) throw new Failure(404, 'No such build.');
		if (!b.ownerId) throw new Failure(409, 'That build has no owner any more to ask.');
		const open = await ShopLink.findOne({
			where: { buildId: b.id, shopId: shop.id, state: ['requested', 'approved'] }
		});
		if (open)
			throw new Failure(
				409,
				open.state === 'approved'
					? 'Your shop is already named on that build.'
					: 'Your shop already asked; the owner has not answered yet.'
			);
		// A shop's own build needs no one's approval.
		const own = b.ownerId === shop.ownerId;
		const l = await ShopLink.create({
			buildId: b.id,
			shopId: shop.id,
			kind: input.kind,
			note: input.note,
			state: own ? 'approved' : 'requested',
			requestedBy: me.id,
			decidedAt: own ? now : null
		});
		await log.append({
			at: now,
			actorId: me.id,
			action: own ? 'link-approve' : 'link-request',
			item: { type: 'build', id: b.id },
			subjectId: b.ownerId,
			detail: { shopId: shop.id, linkId: l.id, kind: input.kind }
		});
		if (!own) {
			const owner = await users.read(b.ownerId);
			if (owner)
				await send(
					linkRequest({
						to: owner.email,
						shopName: shop.name,
						verified: shop.verifiedAt !== null,
						buildId: b.id,
						buildTitle: b.title,
						kind: input.kind,
						note: input.note,
						token: {
							approve: makeToken('shop-link', { l: l.id, d: 'approve' }, now),
							decline: makeToken('shop-link', { l: l.id, d: 'decline' }, now)
						}
					})
				);
		}
		return l;
	});
}

/** What a mailed link is about, for its page (nothing is changed by looking). */
export async function inspectLinkToken(
	token: string,
	now: Date
): Promise<Checked<{ l: number; d: LinkDecision }> & { link?: LinkView | null }> {
	const c = checkToken<{ l: number; d: LinkDecision }>('shop-link', token, now);
	if (!c.ok) return c;
	const view = await describeLink(c.payload.l);
	if (!view) return { ok: false, problem: 'used' };
	if (view.state !== 'requested') return { ok: false, problem: 'used', link: view };
	return { ...c, link: view };
}

export type LinkView = {
	id: number;
	buildId: number;
	buildTitle: string;
	shopName: string;
	kind: 'built' | 'tuned';
	state: ShopLink['state'];
};

async function describeLink(id: number): Promise<LinkView | null> {
	const { ShopLink, Shop } = models();
	const l = await ShopLink.findByPk(id, { include: [{ model: Shop, as: 'shop' }] });
	const b = l && (await builds.read(l.buildId));
	if (!l || !b) return null;
	return {
		id: l.id,
		buildId: b.id,
		buildTitle: b.title,
		shopName: l.shop!.name,
		kind: l.kind,
		state: l.state
	};
}

/**
 * The owner's answer, from the mailed link (the token stands for the owner) or from the build
 * page (`me` must own the build). A request already answered is not answered again.
 */
export async function decideLink(
	by: { token: string } | { me: CurrentUser; linkId: number },
	decision: LinkDecision | null,
	now: Date
): Promise<{ ok: true; link: LinkView } | { ok: false; problem: 'forged' | 'expired' | 'used' }> {
	return inTransaction(async () => {
		const { ShopLink } = models();
		let id: number;
		let d: LinkDecision;
		if ('token' in by) {
			const c = checkToken<{ l: number; d: LinkDecision }>('shop-link', by.token, now);
			if (!c.ok) return c;
			id = c.payload.l;
			d = c.payload.d;
		} else {
			id = by.linkId;
			d = decision!;
		}
		const l = await ShopLink.findByPk(id);
		const b = l && (await builds.read(l.buildId));
		if (!l || !b) return { ok: false, problem: 'used' };
		if ('me' in by && b.ownerId !== by.me.id)
			throw new Failure(404, 'No such request on your builds.');
		// The state check and the change in one statement, so two clicks cannot both count.
		const [changed] = await ShopLink.update(
			{ state: d === 'approve' ? 'approved' : 'declined', decidedAt: now },
			{ where: { id: l.id, state: 'requested' } }
		);
		if (changed !== 1) return { ok: false, problem: 'used' };
		await log.append({
			at: now,
			actorId: 'me' in by ? by.me.id : b.ownerId,
			action: d === 'approve' ? 'link-approve' : 'link-decline',
			item: { type: 'build', id: b.id },
			subjectId: b.ownerId,
			detail: { shopId: l.shopId, linkId: l.id, via: 'token' in by ? 'mail' : 'app' }
		});
		return { ok: true, link: (await describeLink(l.id))! };
	});
}

/** The owner takes a shop's name off their build, at any time. */
export async function unlink(me: CurrentUser, linkId: number, now: Date) {
	return inTransaction(async () => {
		const { ShopLink } = models();
		const l = await ShopLink.findByPk(linkId);
		const b = l && (await builds.read(l.buildId));
		if (!l || !b || b.ownerId !== me.id) throw new Failure(404, 'No such link on your builds.');
		if (l.state !== 'approved')
			throw new Failure(409, 'That link is not shown, so there is nothing to remove.');
		await l.update({ state: 'unlinked', decidedAt: now });
		await log.append({
			at: now,
			actorId: me.id,
			action: 'link-remove',
			item: { type: 'build', id: b.id },
			subjectId: me.id,
			detail: { shopId: l.shopId, linkId: l.id }
		});
	});
}
