import { QueryTypes } from 'sequelize';
import { db } from '../db/connection';

let cached: { at: number; list: string[] } | null = null;
const FRESH_MS = 60_000;

/**
 * Engine families of published builds, for filter lists. Held for a minute: the list changes only
 * when someone names a new family, and a scan of every build on each page view is not worth it.
 */
export async function engineFamilies(now = Date.now()): Promise<string[]> {
	if (cached && now - cached.at < FRESH_MS) return cached.list;
	const rows = await db().query<{ f: string }>(
		"SELECT DISTINCT engine_family AS f FROM builds WHERE publication = 'published' AND moderation = 'visible' AND engine_family <> '' ORDER BY 1 LIMIT 500",
		{ type: QueryTypes.SELECT }
	);
	cached = { at: now, list: rows.map((r) => r.f) };
	return cached.list;
}
