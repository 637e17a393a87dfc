import { fail } from '@sveltejs/kit';
import { message, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import { deskNoteSchema } from '$lib/schemas/review-notes';
import { deskActionSchema } from '$lib/schemas/review';
import { scooterDecisionSchema } from '$lib/schemas/scooters';
import { decideProposal, waitingProposals } from '$lib/server/scooters/proposals';
import { Failure } from '$lib/failure';
import { clock } from '$lib/clock';
import * as deskNotes from '$lib/server/review/notes';
import { requireRole } from '$lib/server/guard';
import { decide, MAILED, NEEDS_REASON } from '$lib/server/review/desk';
import { deskCount, deskCursor, deskQueue } from '$lib/server/review/queue';
import { parseForm } from '$lib/server/web/plain-form';
import { LOG_LABEL } from '$lib/review/kinds';
import { forPages } from '$lib/server/web/page-failure';
import type { Actions, PageServerLoad } from './$types';

const PAGE = 40;

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'moderator');
	const q = event.url.searchParams;
	const order = q.get('order') === 'newest' ? 'newest' : 'oldest';
	const after = q.get('after') ?? undefined;
	const [queue, waiting, notes, form, proposals] = await Promise.all([
		deskQueue({ order, after, limit: PAGE }),
		deskCount(),
		deskNotes.list(),
		superValidate(zod4(deskNoteSchema)),
		waitingProposals()
	]);
	const next = queue.length === PAGE ? deskCursor(queue.at(-1)!) : null;
	return { queue, waiting, order, paged: Boolean(after), next, notes, form, proposals };
};

export const actions: Actions = forPages({
	note: async (event) => {
		const me = requireRole(event, 'moderator');
		const form = await superValidate(event.request, zod4(deskNoteSchema));
		if (!form.valid) return fail(400, { form });
		await deskNotes.create(me.id, form.data.body);
		form.data.body = '';
		return message(form, 'Note pinned to the desk.');
	},
	decide: async (event) => {
		const me = requireRole(event, 'moderator');
		const form = await parseForm(event.request, deskActionSchema);
		const caseId = Number(form.values.caseId) || 0;
		if (!form.ok)
			return fail(400, { desk: { caseId, values: form.values, message: form.message } });
		if (NEEDS_REASON.includes(form.data.action) && !form.data.reason)
			return fail(400, {
				desk: {
					caseId,
					values: form.values,
					message: 'Write the reason first: it is shown to readers or mailed to the author.'
				}
			});
		await decide(me, form.data.caseId, form.data, clock());
		return {
			done: {
				caseId,
				message: `${LOG_LABEL[form.data.action]}. Logged${MAILED.includes(form.data.action) ? ' and mailed to the author' : ''}.`
			}
		};
	},
	scooter: async (event) => {
		const me = requireRole(event, 'moderator');
		const form = await parseForm(event.request, scooterDecisionSchema);
		const scooterId = Number(form.values.scooterId) || 0;
		if (!form.ok) return fail(400, { scooter: { scooterId, message: form.message } });
		if (form.data.decision === 'decline' && !form.data.reason)
			return fail(400, {
				scooter: { scooterId, message: 'Write the reason first: the log keeps it.' }
			});
		try {
			await decideProposal(me, form.data, clock());
		} catch (e) {
			if (!(e instanceof Failure)) throw e;
			return fail(e.status, { scooter: { scooterId, message: e.message } });
		}
		return {
			done: {
				caseId: 0,
				message:
					form.data.decision === 'accept'
						? 'Accepted into the catalogue. Logged.'
						: 'Proposal declined. Logged.'
			}
		};
	}
});
