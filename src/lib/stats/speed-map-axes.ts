// What the speed map can put across and which measuring methods it filters on: plain constants,
// kept apart from the query schemas so the page's scripts do not carry zod.

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
