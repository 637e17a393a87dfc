import { z } from 'zod';
import { CHANGE_KINDS } from '../sheet/change-kinds';
import { EXHAUST_TYPES } from '../sheet/fields';

// The speed map's and change effects' query strings, shared by the pages and GET /api/stats/….

/** What the speed map can put across: the stored column, how to bin it, and its unit. */
export const SPEED_MAP_X = {
	displacement: { label: 'Displacement', col: 's.displacement_cc', unit: 'cc', bin: 2 },
	'final-drive': { label: 'Final-drive ratio', col: 's.final_drive_ratio', unit: ':1', bin: 0.25 },
	'overall-ratio': {
		label: 'Overall ratio at top CVT',
		col: 's.overall_ratio',
		unit: ':1',
		bin: 0.25
	},
	jet: { label: 'Main jet (sea-level equivalent)', col: 's.sea_level_jet', unit: '', bin: 2 },
	rollers: { label: 'Roller weights, total', col: 's.roller_total_g', unit: 'g', bin: 2 },
	exhaust: { label: 'Exhaust type', col: 's.close_pipe', unit: '', bin: 0 },
	elevation: { label: 'Elevation of the run', col: 's.best_run_elevation_m', unit: 'm', bin: 100 }
} as const;
export type SpeedMapX = keyof typeof SPEED_MAP_X;

export const METHODS = [
	{ value: 'gps-logger', label: 'GPS logger' },
	{ value: 'phone-gps', label: 'phone GPS' },
	{ value: 'radar', label: 'radar' },
	{ value: 'speedometer', label: 'speedometer' }
] as const;

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
