import { z } from 'zod';
import { CHANGE_KINDS } from '../sheet/change-kinds';
import { EXHAUST_TYPES } from '../sheet/fields';

// The speed map's and change effects' query strings, shared by the pages and GET /api/stats/….

import { METHODS, SPEED_MAP_X, type SpeedMapX } from '../stats/speed-map-axes';

/** A repeated query parameter (?method=a&method=b) or a comma list, as an array. */
const list = <T extends [string, ...string[]]>(values: T) =>
	z
		.preprocess(
			(v) => (v === undefined || v === '' ? [] : Array.isArray(v) ? v : String(v).split(',')),
			z.array(z.enum(values))
		)
		.catch([]);

const text = z.string().trim().max(120).optional().catch(undefined);

export const speedMapQuerySchema = z.object({
	x: z.enum(Object.keys(SPEED_MAP_X) as [SpeedMapX, ...SpeedMapX[]]).catch('displacement'),
	cycle: z.enum(['two-stroke', 'four-stroke']).optional().catch(undefined),
	family: text,
	method: list(METHODS.map((m) => m.value) as ['gps-logger', 'phone-gps', 'radar', 'speedometer']),
	pipe: list(EXHAUST_TYPES.map((o) => o.value) as [string, ...string[]]),
	twoWay: z.enum(['1']).optional().catch(undefined),
	closed: z.enum(['1']).optional().catch(undefined)
});
export type SpeedMapQuery = z.infer<typeof speedMapQuerySchema>;

const KINDS = CHANGE_KINDS.map((k) => k.kind) as [string, ...string[]];
export const changeEffectsQuerySchema = z.object({
	kind: z.enum(KINDS).optional().catch(undefined)
});

/** Turns URLSearchParams into an object keeping repeated keys as arrays. */
export function paramsObject(p: URLSearchParams): Record<string, string | string[]> {
	const out: Record<string, string | string[]> = {};
	for (const k of new Set(p.keys())) {
		const all = p.getAll(k);
		out[k] = all.length > 1 ? all : all[0];
	}
	return out;
}
