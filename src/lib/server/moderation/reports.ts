import { error } from '@sveltejs/kit';
import { UniqueConstraintError } from 'sequelize';
import type { ReportReason } from '../../moderation/kinds';
import type { CurrentUser } from '../auth/current-user';
import { models } from '../db/models';
import { openCase, refreshCaution } from './cases';
import { requireItem, type ItemRef } from './items';

export type ReportResult = { filed: boolean; caution: boolean };

/**
 * Files a member's report. One open report per person per item (the database keeps it so):
 * a second one changes nothing and says so.
 */
export async function fileReport(
	me: CurrentUser,
	ref: ItemRef,
	input: { reason: ReportReason; note: string },
	now: Date
): Promise<ReportResult> {
	const item = await requireItem(ref);
	// Only what the reporter can see can be reported; a draft's existence stays hidden.
	if (!item.open && item.authorId !== me.id) error(404, 'No such item.');
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
		if (e instanceof UniqueConstraintError) return { filed: false, caution: false };
		throw e;
	}
	await openCase(ref, item.authorId, now);
	return { filed: true, caution: await refreshCaution(ref) };
}
