import { Failure } from '$lib/failure';
import { error, fail, redirect } from '@sveltejs/kit';
import QRCode from 'qrcode';
import {
	commentEditSchema,
	commentRefSchema,
	commentSchema,
	itemRefSchema
} from '$lib/schemas/review';
import { clock } from '$lib/clock';
import {
	createComment,
	deleteComment,
	editComment,
	listComments
} from '$lib/server/comments/comments';
import { env } from '$lib/server/env';
import { requireUser } from '$lib/server/guard';
import { askSecondLook } from '$lib/server/review/desk';
import { pageStanding } from '$lib/server/review/standing';
import { parseForm } from '$lib/server/web/plain-form';
import { decideLink, pendingLinks, shownLinks, unlink } from '$lib/server/shops/links';
import { shopOf } from '$lib/server/shops/pages';
import { linkDecisionSchema, linkRefSchema } from '$lib/schemas/shops';
import { readBuild } from '$lib/server/sheet/access';
import { unitsFor } from '$lib/server/sheet/units';
import { buildView } from '$lib/server/sheet/view';
import { stepsOf } from '$lib/server/stats/change-effects';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

export const load: PageServerLoad = async (event) => {
	const { build, canEdit } = await readBuild(event, Number(event.params.id));
	const units = unitsFor(event);
	const me = event.locals.user;
	const link = new URL(`/builds/${build.id}`, env().ORIGIN).toString();
	// A small QR code for the printed sheet, so a paper copy leads back to the live one.
	const qr = await QRCode.toString(link, { type: 'svg', margin: 0, errorCorrectionLevel: 'M' });
	const mine = me !== null && me.id === build.ownerId;
	const [view, steps, comments, shops, pendingShops, myShop] = await Promise.all([
		buildView(build, units),
		stepsOf(build.id),
		listComments(build, me),
		shownLinks(build.id),
		mine ? pendingLinks(build.id) : [],
		me && !me.suspension ? shopOf(me) : null
	]);
	// A shop that acts here may ask to be named, unless it already is.
	const canAskLink =
		myShop !== null &&
		build.publication === 'published' &&
		build.moderation === 'visible' &&
		!shops.some((l) => l.shopId === myShop.id);
	const standing = await pageStanding(
		build,
		view.setups.map((s) => s.id),
		me
	);
	// A setup the desk took down leaves only its reason for readers who may not see it.
	const takenDown = standing.seesHidden
		? []
		: view.setups
				.filter((s) => s.moderation === 'hidden')
				.map((s) => ({ id: s.id, position: s.position, hiddenReason: s.hiddenReason }));
	if (!standing.seesHidden) view.setups = view.setups.filter((s) => s.moderation !== 'hidden');
	const canComment =
		build.publication === 'published' && build.moderation === 'visible' && !me?.suspension;
	return {
		units,
		canEdit,
		link,
		qr,
		steps,
		comments,
		standing,
		canComment,
		takenDown,
		shops,
		pendingShops,
		mine,
		askAs: canAskLink ? myShop!.name : null,
		...view
	};
};

/** The build behind an action, readable by the member acting. */
async function target(event: RequestEvent) {
	const me = requireUser(event);
	const { build } = await readBuild(event, Number(event.params.id));
	return { me, build };
}

const back = (buildId: number, anchor: string) => redirect(303, `/builds/${buildId}#${anchor}`);

export const actions: Actions = forPages({
	decideLink: async (event) => {
		const { me, build } = await target(event);
		const form = await parseForm(event.request, linkDecisionSchema);
		if (!form.ok) return fail(400, { shops: { message: form.message } });
		const r = await decideLink({ me, linkId: form.data.linkId }, form.data.decision, clock());
		if (!r.ok) return fail(409, { shops: { message: 'That request is already answered.' } });
		back(build.id, 'shops');
	},
	unlink: async (event) => {
		const { me, build } = await target(event);
		const form = await parseForm(event.request, linkRefSchema);
		if (!form.ok) return fail(400, { shops: { message: form.message } });
		await unlink(me, form.data.linkId, clock());
		back(build.id, 'shops');
	},
	comment: async (event) => {
		const { me, build } = await target(event);
		const form = await parseForm(event.request, commentSchema);
		const slot = form.values.parentId ? `reply-${form.values.parentId}` : 'new';
		if (!form.ok)
			return fail(400, {
				commentAnswer: { slot, body: form.values.body ?? '', message: form.message }
			});
		try {
			const c = await createComment(me, build, form.data, event.getClientAddress(), clock());
			back(build.id, `comment-${c.id}`);
		} catch (e) {
			if (e instanceof Failure)
				return fail(e.status, {
					commentAnswer: { slot, body: form.data.body, message: e.message }
				});
			throw e;
		}
	},
	editComment: async (event) => {
		const { me, build } = await target(event);
		const form = await parseForm(event.request, commentEditSchema);
		const slot = `edit-${form.values.commentId}`;
		if (!form.ok)
			return fail(400, {
				commentAnswer: { slot, body: form.values.body ?? '', message: form.message }
			});
		const c = await editComment(me, form.data.commentId, form.data.body, clock());
		if (c.buildId !== build.id) error(404, 'No such comment on this build.');
		back(build.id, `comment-${c.id}`);
	},
	deleteComment: async (event) => {
		const { me, build } = await target(event);
		const form = await parseForm(event.request, commentRefSchema);
		if (!form.ok)
			return fail(400, { commentAnswer: { slot: 'delete', body: '', message: form.message } });
		const c = await deleteComment(me, form.data.commentId, clock());
		back(build.id, `comment-${c.id}`);
	},
	secondLook: async (event) => {
		const { me, build } = await target(event);
		const form = await parseForm(event.request, itemRefSchema);
		if (!form.ok) return fail(400, { look: { message: form.message } });
		const r = await askSecondLook(me, { type: form.data.itemType, id: form.data.itemId }, clock());
		if (!r.ok) return fail(409, { look: { message: r.message } });
		return {
			look: { message: 'Asked. The review desk will look at it again and mail you the decision.' },
			buildId: build.id
		};
	}
});
