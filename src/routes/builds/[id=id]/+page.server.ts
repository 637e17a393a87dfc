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
import { recent } from '$lib/recent';
import { createComment, deleteComment, editComment } from '$lib/server/comments/comments';
import { env } from '$lib/server/env';
import { requireUser } from '$lib/server/guard';
import { askSecondLook } from '$lib/server/review/desk';
import { parseForm } from '$lib/server/web/plain-form';
import { decideLink, unlink } from '$lib/server/shops/links';
import { buildPage } from '$lib/server/pages/build-page';
import { linkDecisionSchema, linkRefSchema } from '$lib/schemas/shops';
import { readBuild } from '$lib/server/sheet/access';
import { unitsFor } from '$lib/server/sheet/units';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

export const load: PageServerLoad = async (event) => {
	const { build, canEdit } = await readBuild(event, Number(event.params.id));
	const units = unitsFor(event);
	const link = new URL(`/builds/${build.id}`, env().ORIGIN).toString();
	const page = await buildPage(build, event.locals.user, units, clock());
	return { units, canEdit, link, qr: await qrFor(link), ...page };
};

// A small QR code for the printed sheet, so a paper copy leads back to the live one. Drawing one
// costs more than the page's queries, and a link's code never changes: the last few are kept.
const qrCodes = recent<Promise<string>>(500);
const qrFor = (link: string) =>
	qrCodes(link, () => QRCode.toString(link, { type: 'svg', margin: 0, errorCorrectionLevel: 'M' }));

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
