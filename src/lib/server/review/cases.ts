import { QueryTypes } from 'sequelize';
import { UNSAFE_REPORTS_FOR_CAUTION, type ItemType } from '../../review/kinds';
import { db } from '../db/connection';
import { models } from '../db/models';
import type { ItemRef } from './items';

/** Puts an item on the desk's list (opening a case the first time), oldest first by this moment. */
export async function openCase(ref: ItemRef, authorId: string | null, now: Date) {
	const { ReviewCase } = models();
	const found = await ReviewCase.findOne({ where: { itemType: ref.type, itemId: ref.id } });
	if (!found) {
		return ReviewCase.create({
			itemType: ref.type,
			itemId: ref.id,
			authorId,
			openedAt: now,
			updatedAt: now
		});
	}
	if (!found.onDesk) {
		found.onDesk = true;
		found.openedAt = now;
	}
	found.updatedAt = now;
	await found.save();
	return found;
}

export async function readCase(ref: ItemRef) {
	return models().ReviewCase.findOne({ where: { itemType: ref.type, itemId: ref.id } });
}

/**
 * The caution banner's rule, in one place: a moderator triaged the item as a real concern, or
 * three different members reported it as unsafe, or an automatic flag is open. One report alone
 * never shows it.
 */
export async function refreshCaution(ref: ItemRef): Promise<boolean> {
	const [row] = await db().query<{ unsafe: number; flags: number }>(
		`SELECT
			(SELECT COUNT(DISTINCT reporter_id) FROM reports
			 WHERE item_type = :t AND item_id = :id AND status = 'open' AND reason = 'unsafe') AS unsafe,
			(SELECT COUNT(*) FROM flags WHERE item_type = :t AND item_id = :id AND status = 'open') AS flags`,
		{ replacements: { t: ref.type, id: ref.id }, type: QueryTypes.SELECT }
	);
	const c = await readCase(ref);
	if (!c) return false;
	const caution =
		c.concern || Number(row.unsafe) >= UNSAFE_REPORTS_FOR_CAUTION || Number(row.flags) > 0;
	if (c.caution !== caution) await c.update({ caution });
	return caution;
}

/** Closes an item's open reports and flags: the desk has decided on them. */
export async function closeSignals(ref: ItemRef, now: Date): Promise<void> {
	const { Report, Flag } = models();
	const where = { itemType: ref.type, itemId: ref.id, status: 'open' as const };
	await Report.update({ status: 'closed', closedAt: now }, { where });
	await Flag.update({ status: 'closed', closedAt: now }, { where });
}

/** Which of these items carry the caution banner now. */
export async function cautionsFor(type: ItemType, ids: number[]): Promise<Set<number>> {
	if (!ids.length) return new Set();
	const rows = await models().ReviewCase.findAll({
		where: { itemType: type, itemId: ids, caution: true },
		attributes: ['itemId']
	});
	return new Set(rows.map((r) => r.itemId));
}
