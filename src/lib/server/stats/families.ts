import { QueryTypes } from 'sequelize';
import { db } from '../db/connection';

let cached: { at: number; list: Promise<string[]> } | null = null;
const FRESH_MS = 60_000;

/**
 * Engine families of published builds, for filter lists. Held for a minute: the list changes only
 * when someone names a new family, and a scan of every build on each page view is not worth it.
 * The read in flight is shared too, so a busy minute's first page views start one scan, not one each.
 */
export async function engineFamilies(now = Date.now()): Promise<string[]> {
	if (cached && now - cached.at < FRESH_MS) return cached.list;
	const list = db()
		.query<{ f: string }>(
			"SELECT DISTINCT engine_family AS f FROM builds WHERE publication = 'published' AND moderation = 'visible' AND engine_family <> '' ORDER BY 1 LIMIT 500",
			{ type: QueryTypes.SELECT }
		)
		.then((rows) => rows.map((r) => r.f));
	const entry = { at: now, list };
	cached = entry;
	// A failed read is not kept: the next view tries again.
	list.catch(() => {
		if (cached === entry) cached = null;
	});
	return list;
}
