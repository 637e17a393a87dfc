import { Failure } from '../../failure';
import { UniqueConstraintError } from 'sequelize';
import { REPORT_NOTE_MAX, type ReportReason } from '../../review/kinds';
import type { CurrentUser } from '../auth/current-user';
import { reportsByAccount, reportsByAddress, spend, waitText } from '../auth/limits';
import { models } from '../db/models';
import { openCase, refreshCaution } from './cases';
import { requireItem, type ItemRef } from './items';
import { inTransaction } from '../db/transaction';

export type ReportResult = { filed: boolean; added: boolean; caution: boolean };

/**
 * Files a member's report. One open report per person per item (the database keeps it so): a
 * second one while the first is open adds its note to it and takes its reason. Reports are
 * limited per account and per address (429), so the desk cannot be flooded from one place.
 */
export async function fileReport(
	me: CurrentUser,
	ref: ItemRef,
	input: { reason: ReportReason; note: string },
	now: Date,
	address: string
): Promise<ReportResult> {
	const limit = await spend([
		[reportsByAccount, me.id],
		[reportsByAddress, address]
	]);
	if (!limit.ok)
		throw new Failure(
			429,
			`You have sent a lot of reports in a short time. Try again in ${waitText(limit.retryAfterS)}; your note is kept.`
		);
	return inTransaction(async () => {
		const item = await requireItem(ref);
		// Only what the reporter can see can be reported; a draft's existence stays hidden.
		if (!item.open && item.authorId !== me.id) throw new Failure(404, 'No such item.');
		try {
			await models().Report.create({
				itemType: ref.type,
				itemId: ref.id,
				reporterId: me.id,
				reason: input.reason,
				note: input.note,
				createdAt: now
			});
		} catch (e) {
			if (!(e instanceof UniqueConstraintError)) throw e;
			// Their report is still open: what they send now is added to it (the reason they chose
			// last counts), rather than refused.
			await addToOpenReport(me.id, ref, input);
			return { filed: true, added: true, caution: await refreshCaution(ref) };
		}
		await openCase(ref, item.authorId, now);
		return { filed: true, added: false, caution: await refreshCaution(ref) };
	});
}

async function addToOpenReport(
	reporterId: string,
	ref: ItemRef,
	input: { reason: ReportReason; note: string }
) {
	const { Report } = models();
	const open = await Report.findOne({
		where: { itemType: ref.type, itemId: ref.id, reporterId, status: 'open' }
	});
	if (!open) return;
	const note = [open.note, input.note].filter((n) => n.trim()).join('\n\n');
	await open.update({ reason: input.reason, note: note.slice(0, REPORT_NOTE_MAX) });
}
