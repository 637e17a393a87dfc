import { parseTyre, SPEED_SYMBOLS } from '../tuning';
import { EXHAUST_TYPES, type Field } from './fields';
import { parseRollers } from './rollers';

const o = (...v: string[]) => v.map((x) => ({ value: x, label: x.replace(/-/g, ' ') }));

function checkTyre(v: string): string | null {
	try {
		parseTyre(v);
		return null;
	} catch {
		return 'We cannot read that size; write it as on the sidewall, e.g. 120/70-12 51L or 3.50-10.';
	}
}

/** Every field of a setup: the complete configuration at one moment. */
export const SETUP_FIELDS: Field[] = [
	{
		name: 'changeNote',
		label: 'What changed',
		section: 'Summary',
		kind: 'text',
		maxLength: 200,
		min: 2,
		always: true,
		hint: 'e.g. “expansion chamber, main jet 92 → 98”'
	},
	{ name: 'isStock', label: 'This is the stock baseline', section: 'Summary', kind: 'checkbox' },
	{
		name: 'bore',
		label: 'Bore',
		section: 'Cylinder',
		kind: 'number',
		dim: 'length',
		min: 30,
		max: 80
	},
	{
		name: 'stroke',
		label: 'Stroke',
		section: 'Cylinder',
		kind: 'number',
		dim: 'length',
		min: 30,
		max: 70
	},
	{
		name: 'kitMaterial',
		label: 'Cylinder material',
		section: 'Cylinder',
		kind: 'select',
		insideEngine: true,
		options: o('cast-iron', 'plated-aluminium', 'other')
	},
	{
		name: 'chamberCc',
		label: 'Chamber volume',
		section: 'Cylinder',
		kind: 'number',
		unit: 'cc',
		min: 2,
		max: 40,
		optional: true
	},
	{
		name: 'squish',
		label: 'Squish clearance',
		section: 'Cylinder',
		kind: 'number',
		dim: 'length',
		min: 0.3,
		max: 3,
		insideEngine: true,
		hint: 'Measured with crushed solder, head off; a stock baseline may leave it empty.'
	},
	{
		name: 'baseGasket',
		label: 'Base gasket',
		section: 'Cylinder',
		kind: 'number',
		dim: 'length',
		min: 0,
		max: 3,
		optional: true
	},
	{
		name: 'headGasket',
		label: 'Head gasket',
		section: 'Cylinder',
		kind: 'number',
		dim: 'length',
		min: 0,
		max: 3,
		optional: true
	},
	{
		name: 'compressionMeasured',
		label: 'Compression ratio (measured)',
		section: 'Cylinder',
		kind: 'number',
		unit: ': 1',
		min: 4,
		max: 20,
		optional: true
	},
	{
		name: 'exhaustDuration',
		label: 'Exhaust duration',
		section: 'Ports',
		kind: 'number',
		unit: '°',
		min: 90,
		max: 220,
		optional: true
	},
	{
		name: 'transferDuration',
		label: 'Transfer duration',
		section: 'Ports',
		kind: 'number',
		unit: '°',
		min: 90,
		max: 160,
		optional: true
	},
	{
		name: 'exhaustHeight',
		label: 'Exhaust roof below TDC',
		section: 'Ports',
		kind: 'number',
		dim: 'length',
		min: 1,
		max: 40,
		optional: true
	},
	{
		name: 'transferHeight',
		label: 'Transfer roof below TDC',
		section: 'Ports',
		kind: 'number',
		dim: 'length',
		min: 1,
		max: 60,
		optional: true
	},
	{
		name: 'rod',
		label: 'Con-rod length',
		section: 'Ports',
		kind: 'number',
		dim: 'length',
		min: 60,
		max: 130,
		optional: true
	},
	{ name: 'casePorted', label: 'Case porting done', section: 'Ports', kind: 'checkbox' },
	{
		name: 'casePortingNote',
		label: 'Case porting note',
		section: 'Ports',
		kind: 'text',
		maxLength: 300,
		optional: true
	},
	{
		name: 'carbBore',
		label: 'Carburettor bore',
		section: 'Intake',
		kind: 'number',
		dim: 'length',
		min: 10,
		max: 40
	},
	{
		name: 'reedType',
		label: 'Reed valve',
		section: 'Intake',
		kind: 'text',
		maxLength: 120,
		optional: true
	},
	{
		name: 'airFilter',
		label: 'Air filter',
		section: 'Intake',
		kind: 'text',
		maxLength: 120,
		optional: true
	},
	{
		name: 'mainJet',
		label: 'Main jet',
		section: 'Jetting',
		kind: 'number',
		unit: 'size',
		min: 40,
		max: 300
	},
	{
		name: 'jetNumbering',
		label: 'Jet series numbered',
		section: 'Jetting',
		kind: 'select',
		options: [
			{ value: 'diameter', label: 'by diameter' },
			{ value: 'flow', label: 'by flow' }
		]
	},
	{
		name: 'pilotJet',
		label: 'Pilot jet',
		section: 'Jetting',
		kind: 'number',
		unit: 'size',
		min: 10,
		max: 80,
		optional: true
	},
	{
		name: 'needleClip',
		label: 'Needle clip position (1 = top groove)',
		section: 'Jetting',
		kind: 'int',
		min: 1,
		max: 6,
		optional: true
	},
	{
		name: 'needle',
		label: 'Needle',
		section: 'Jetting',
		kind: 'text',
		maxLength: 80,
		optional: true
	},
	{
		name: 'needleJet',
		label: 'Needle jet',
		section: 'Jetting',
		kind: 'text',
		maxLength: 80,
		optional: true
	},
	{
		name: 'airScrewTurns',
		label: 'Air screw, turns out',
		section: 'Jetting',
		kind: 'number',
		unit: 'turns',
		min: 0,
		max: 5,
		optional: true
	},
	{
		name: 'ignitionType',
		label: 'Ignition',
		section: 'Ignition',
		kind: 'text',
		maxLength: 120,
		optional: true
	},
	{
		name: 'plugHeatRange',
		label: 'Spark plug heat range',
		section: 'Ignition',
		kind: 'text',
		maxLength: 40,
		optional: true
	},
	{
		name: 'exhaustType',
		label: 'Exhaust type',
		section: 'Exhaust',
		kind: 'select',
		options: EXHAUST_TYPES
	},
	{
		name: 'powerBandFrom',
		label: 'Power band from',
		section: 'Exhaust',
		kind: 'int',
		unit: 'rpm',
		min: 2000,
		max: 16000,
		optional: true
	},
	{
		name: 'powerBandTo',
		label: 'Power band to',
		section: 'Exhaust',
		kind: 'int',
		unit: 'rpm',
		min: 2000,
		max: 16000,
		optional: true
	},
	{ name: 'restrictorRemoved', label: 'Restrictor removed', section: 'Exhaust', kind: 'checkbox' },
	{
		name: 'variatorType',
		label: 'Variator',
		section: 'CVT',
		kind: 'text',
		maxLength: 120,
		optional: true
	},
	{
		name: 'rollerSize',
		label: 'Roller size',
		section: 'CVT',
		kind: 'text',
		maxLength: 20,
		optional: true,
		hint: 'e.g. 16 × 13'
	},
	{
		name: 'rollerWeights',
		label: 'Roller weights per slot',
		section: 'CVT',
		kind: 'text',
		maxLength: 80,
		check: (v) => parseRollers(v).problem,
		hint: 'grams: “3x5.0 + 3x4.5” or “5, 5, 5, 4.5, 4.5, 4.5”'
	},
	{
		name: 'torqueSpring',
		label: 'Torque (contra) spring',
		section: 'CVT',
		kind: 'text',
		maxLength: 80,
		optional: true
	},
	{
		name: 'clutchSprings',
		label: 'Clutch springs',
		section: 'CVT',
		kind: 'text',
		maxLength: 80,
		optional: true
	},
	{
		name: 'clutchEngageRpm',
		label: 'Clutch engagement',
		section: 'CVT',
		kind: 'int',
		unit: 'rpm',
		min: 1500,
		max: 9000,
		optional: true
	},
	{ name: 'belt', label: 'Belt', section: 'CVT', kind: 'text', maxLength: 80, optional: true },
	{
		name: 'topCvtRatio',
		label: 'Top CVT ratio',
		section: 'CVT',
		kind: 'number',
		unit: ': 1',
		min: 0.6,
		max: 1.5,
		optional: true,
		hint: 'If unknown, 0.85 is used for the sums (a typical fully shifted ratio).'
	},
	{
		name: 'primaryDriver',
		label: 'First stage: driver teeth',
		section: 'Final drive',
		kind: 'int',
		unit: 'teeth',
		min: 8,
		max: 80
	},
	{
		name: 'primaryDriven',
		label: 'First stage: driven teeth',
		section: 'Final drive',
		kind: 'int',
		unit: 'teeth',
		min: 8,
		max: 80
	},
	{
		name: 'secondaryDriver',
		label: 'Second stage: driver teeth',
		section: 'Final drive',
		kind: 'int',
		unit: 'teeth',
		min: 8,
		max: 80,
		optional: true
	},
	{
		name: 'secondaryDriven',
		label: 'Second stage: driven teeth',
		section: 'Final drive',
		kind: 'int',
		unit: 'teeth',
		min: 8,
		max: 80,
		optional: true
	},
	{
		name: 'rearTyre',
		label: 'Rear tyre size',
		section: 'Tyre',
		kind: 'text',
		maxLength: 40,
		check: checkTyre,
		hint: 'As on the sidewall, e.g. 120/70-12 51L'
	},
	{
		name: 'tyreSpeedSymbol',
		label: 'Tyre speed symbol',
		section: 'Tyre',
		kind: 'text',
		maxLength: 1,
		optional: true,
		check: (v) => (SPEED_SYMBOLS[v.toUpperCase()] ? null : 'A speed symbol letter from B to Y.'),
		hint: 'The letter after the load index (J, L, P…); read from the size when given there.'
	},
	{
		name: 'octane',
		label: 'Fuel octane (RON)',
		section: 'Fuel',
		kind: 'int',
		min: 80,
		max: 110,
		optional: true
	},
	{
		name: 'lubrication',
		label: 'Lubrication',
		section: 'Fuel',
		kind: 'select',
		options: o('premix', 'oil-injection')
	},
	{
		name: 'premixRatio',
		label: 'Premix ratio',
		section: 'Fuel',
		kind: 'number',
		unit: ': 1',
		min: 20,
		max: 100,
		optional: true
	},
	{ name: 'oilType', label: 'Oil', section: 'Fuel', kind: 'text', maxLength: 80, optional: true },
	{
		name: 'peakRpm',
		label: 'Peak rpm seen (tachometer)',
		section: 'Fuel',
		kind: 'int',
		unit: 'rpm',
		min: 3000,
		max: 16000,
		optional: true
	}
];

/** Used for the gearing sums when no top CVT ratio was measured. */
export const DEFAULT_TOP_CVT = 0.85;

/** A stock baseline's fields: what needs the engine open may stay empty when publishing. */
export const STOCK_BASELINE_FIELDS: Field[] = SETUP_FIELDS.map((f) =>
	f.insideEngine ? { ...f, optional: true } : f
);
