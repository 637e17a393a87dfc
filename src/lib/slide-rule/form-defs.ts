import { convertTyped, dimOf, type FieldDef, type FormValues } from './forms';
import type { Units } from './types';
import type { CalculatorName } from './index';

const portModes = [
	{ value: 'height', label: 'roof height below TDC' },
	{ value: 'duration', label: 'duration in degrees' }
];
const pressureKinds = [
	{ value: 'sea-level', label: 'sea-level reading (weather report)' },
	{ value: 'station', label: 'measured at the place' }
];
const timingModes = [
	{ value: 'degrees', label: 'degrees before TDC' },
	{ value: 'drop', label: 'a dial-gauge reading' }
];
const numberings = [
	{ value: 'diameter', label: 'by orifice diameter' },
	{ value: 'flow', label: 'by flow' }
];

const place = (prefix: string, group: string, name: (s: string) => string): FieldDef[] => [
	{ name: name('elevation'), label: `${prefix}Elevation`, kind: 'number', dim: 'elevation', group },
	{ name: name('temp'), label: `${prefix}Air temperature`, kind: 'number', dim: 'temp', group },
	{ name: name('humidity'), label: `${prefix}Relative humidity`, kind: 'number', unit: '%', group },
	{
		name: name('pressure'),
		label: `${prefix}Air pressure`,
		kind: 'number',
		dim: 'pressure',
		optional: true,
		hint: 'Leave empty for the standard atmosphere at that elevation.',
		group
	},
	{
		name: name('pressureKind'),
		label: `${prefix}That pressure is a`,
		kind: 'select',
		options: pressureKinds,
		group
	}
];
const cap = (p: string) => (s: string) => p + s[0].toUpperCase() + s.slice(1);

export const FORMS: Record<CalculatorName, FieldDef[]> = {
	cylinder: [
		{ name: 'bore', label: 'Bore', kind: 'number', dim: 'length', group: 'Cylinder' },
		{ name: 'stroke', label: 'Stroke', kind: 'number', dim: 'length', group: 'Cylinder' },
		{
			name: 'rod',
			label: 'Con-rod length (centres)',
			kind: 'number',
			dim: 'length',
			optional: true,
			group: 'Cylinder'
		},
		{
			name: 'chamberCc',
			label: 'Combustion chamber volume',
			kind: 'number',
			unit: 'cc',
			optional: true,
			hint: 'Measured with a burette, piston at TDC.',
			group: 'Cylinder'
		},
		{
			name: 'exhaustMode',
			label: 'Exhaust port: I know its',
			kind: 'select',
			options: portModes,
			group: 'Ports'
		},
		{
			name: 'exhaust',
			label: 'Exhaust port',
			kind: 'number',
			dim: 'length',
			modeField: 'exhaustMode',
			optional: true,
			hint: 'Height: roof below the crown edge at TDC. Duration: degrees open.',
			group: 'Ports'
		},
		{
			name: 'transferMode',
			label: 'Transfer ports: I know their',
			kind: 'select',
			options: portModes,
			group: 'Ports'
		},
		{
			name: 'transfer',
			label: 'Transfer ports',
			kind: 'number',
			dim: 'length',
			modeField: 'transferMode',
			optional: true,
			group: 'Ports'
		},
		{
			name: 'rpm',
			label: 'Engine speed for piston speed',
			kind: 'number',
			unit: 'rpm',
			optional: true,
			group: 'Running'
		},
		{
			name: 'squish',
			label: 'Squish clearance (crushed solder)',
			kind: 'number',
			dim: 'length',
			optional: true,
			group: 'Running'
		}
	],
	gearing: [
		{
			name: 'peakRpm',
			label: 'Peak engine speed',
			kind: 'number',
			unit: 'rpm',
			group: 'Engine and CVT'
		},
		{
			name: 'topCvt',
			label: 'CVT ratio at top',
			kind: 'number',
			unit: ': 1',
			hint: 'Engine rpm ÷ driven pulley rpm; about 0.75–0.9 fully shifted.',
			group: 'Engine and CVT'
		},
		{
			name: 'launchCvt',
			label: 'CVT ratio at launch',
			kind: 'number',
			unit: ': 1',
			optional: true,
			hint: 'About 2.4–2.8.',
			group: 'Engine and CVT'
		},
		{
			name: 'primaryDriver',
			label: 'First stage: driver teeth',
			kind: 'number',
			unit: 'teeth',
			group: 'Final drive'
		},
		{
			name: 'primaryDriven',
			label: 'First stage: driven teeth',
			kind: 'number',
			unit: 'teeth',
			group: 'Final drive'
		},
		{
			name: 'secondaryDriver',
			label: 'Second stage: driver teeth',
			kind: 'number',
			unit: 'teeth',
			optional: true,
			group: 'Final drive'
		},
		{
			name: 'secondaryDriven',
			label: 'Second stage: driven teeth',
			kind: 'number',
			unit: 'teeth',
			optional: true,
			group: 'Final drive'
		},
		{
			name: 'tyre',
			label: 'Rear tyre size',
			kind: 'text',
			hint: 'As on the sidewall, e.g. 120/70-12 51J or 3.50-10.',
			group: 'Wheel'
		},
		{
			name: 'rollingFactor',
			label: 'Rolling factor',
			kind: 'number',
			unit: '×',
			hint: 'Measured rolling circumference ÷ calculated; 1 if unknown.',
			group: 'Wheel'
		},
		{
			name: 'checkSpeed',
			label: 'Engine speed at this road speed',
			kind: 'number',
			dim: 'speed',
			optional: true,
			group: 'Checks'
		},
		{
			name: 'stockSpeed',
			label: 'Stock top speed (measured)',
			kind: 'number',
			dim: 'speed',
			optional: true,
			group: 'Checks'
		},
		{
			name: 'brakesUpgraded',
			label: 'Brakes upgraded for the extra speed',
			kind: 'checkbox',
			group: 'Checks'
		}
	],
	'air-and-jets': [
		...place('', 'The place', (s) => s),
		{
			name: 'jet',
			label: 'Main jet (optional)',
			kind: 'number',
			unit: 'size',
			optional: true,
			group: 'Jetting'
		},
		{
			name: 'numbering',
			label: 'The jet series is numbered',
			kind: 'select',
			options: numberings,
			group: 'Jetting'
		}
	],
	retune: [
		{
			name: 'jet',
			label: 'Main jet that runs right there',
			kind: 'number',
			unit: 'size',
			group: 'Jetting'
		},
		{
			name: 'numbering',
			label: 'The jet series is numbered',
			kind: 'select',
			options: numberings,
			group: 'Jetting'
		},
		{
			name: 'step',
			label: 'Step between jet sizes',
			kind: 'number',
			unit: 'size',
			hint: 'e.g. 2 for 96, 98, 100…',
			group: 'Jetting'
		},
		...place('Jetted at: ', 'Where it was jetted', cap('from')),
		...place('Ridden at: ', 'Where it will be ridden', cap('to'))
	],
	pipe: [
		{
			name: 'exhaustDuration',
			label: 'Exhaust duration',
			kind: 'number',
			unit: '°',
			hint: 'Degrees the exhaust port stays open (the Cylinder sheet works it out from the port height).',
			group: 'Port and speed'
		},
		{
			name: 'rpm',
			label: 'Engine speed the pipe should work at',
			kind: 'number',
			unit: 'rpm',
			group: 'Port and speed'
		},
		{
			name: 'gasTemp',
			label: 'Exhaust gas temperature in the pipe',
			kind: 'number',
			dim: 'temp',
			optional: true,
			hint: 'Empty: Jennings’s 1,700 ft/s wave speed (about 395 °C).',
			group: 'Port and speed'
		}
	],
	'time-area': [
		{ name: 'bore', label: 'Bore', kind: 'number', dim: 'length', group: 'Cylinder' },
		{ name: 'stroke', label: 'Stroke', kind: 'number', dim: 'length', group: 'Cylinder' },
		{
			name: 'rod',
			label: 'Con-rod length (centres)',
			kind: 'number',
			dim: 'length',
			group: 'Cylinder'
		},
		{
			name: 'rpm',
			label: 'Engine speed of peak power',
			kind: 'number',
			unit: 'rpm',
			group: 'Cylinder'
		},
		{
			name: 'exhaustWidth',
			label: 'Exhaust port width (chord)',
			kind: 'number',
			dim: 'length',
			hint: 'Add the auxiliary ports’ widths if they open with the main port.',
			group: 'Exhaust'
		},
		{
			name: 'exhaustMode',
			label: 'Exhaust port: I know its',
			kind: 'select',
			options: portModes,
			group: 'Exhaust'
		},
		{
			name: 'exhaust',
			label: 'Exhaust port',
			kind: 'number',
			dim: 'length',
			modeField: 'exhaustMode',
			hint: 'Height: roof below the crown edge at TDC. Duration: degrees open.',
			group: 'Exhaust'
		},
		{
			name: 'transferWidth',
			label: 'Transfer ports, widths added together',
			kind: 'number',
			dim: 'length',
			group: 'Transfers'
		},
		{
			name: 'transferMode',
			label: 'Transfer ports: I know their',
			kind: 'select',
			options: portModes,
			group: 'Transfers'
		},
		{
			name: 'transfer',
			label: 'Transfer ports',
			kind: 'number',
			dim: 'length',
			modeField: 'transferMode',
			group: 'Transfers'
		}
	],
	carb: [
		{ name: 'displacementCc', label: 'Displacement', kind: 'number', unit: 'cc', group: 'Engine' },
		{
			name: 'peakRpm',
			label: 'Engine speed of peak power',
			kind: 'number',
			unit: 'rpm',
			group: 'Engine'
		},
		{
			name: 'k',
			label: 'Constant K',
			kind: 'number',
			unit: '×',
			hint: 'About 0.65 for broad road power, 0.9 for racing; 0.8 if unsure.',
			group: 'Engine'
		}
	],
	'dial-gauge': [
		{ name: 'stroke', label: 'Stroke', kind: 'number', dim: 'length', group: 'Crank' },
		{
			name: 'rod',
			label: 'Con-rod length (centres)',
			kind: 'number',
			dim: 'length',
			group: 'Crank'
		},
		{
			name: 'mode',
			label: 'I have',
			kind: 'select',
			options: timingModes,
			group: 'Ignition timing'
		},
		{
			name: 'value',
			label: 'Timing',
			kind: 'number',
			dim: 'length',
			modeField: 'mode',
			modeValue: 'degrees',
			optional: true,
			hint: 'Degrees before TDC, or the gauge reading below TDC.',
			group: 'Ignition timing'
		},
		{
			name: 'stopFirst',
			label: 'Wheel at the stop, turning forward',
			kind: 'number',
			unit: '°',
			optional: true,
			group: 'Degree wheel'
		},
		{
			name: 'stopSecond',
			label: 'Wheel at the stop, turning back',
			kind: 'number',
			unit: '°',
			optional: true,
			group: 'Degree wheel'
		},
		{
			name: 'opens',
			label: 'Wheel where a port opens',
			kind: 'number',
			unit: '°',
			optional: true,
			group: 'Degree wheel'
		},
		{
			name: 'closes',
			label: 'Wheel where it closes',
			kind: 'number',
			unit: '°',
			optional: true,
			group: 'Degree wheel'
		}
	],
	premix: [
		{ name: 'fuel', label: 'Fuel', kind: 'number', dim: 'volume', group: 'Mixing' },
		{ name: 'ratio', label: 'Ratio, fuel to oil', kind: 'number', unit: ': 1', group: 'Mixing' },
		{
			name: 'tank',
			label: 'Mix already in the tank',
			kind: 'number',
			dim: 'volume',
			optional: true,
			group: 'Topping up'
		},
		{
			name: 'currentRatio',
			label: 'Its ratio',
			kind: 'number',
			unit: ': 1',
			optional: true,
			group: 'Topping up'
		},
		{
			name: 'add',
			label: 'Fuel you add',
			kind: 'number',
			dim: 'volume',
			optional: true,
			group: 'Topping up'
		},
		{
			name: 'targetRatio',
			label: 'Ratio you want',
			kind: 'number',
			unit: ': 1',
			optional: true,
			group: 'Topping up'
		}
	],
	belt: [
		{
			name: 'drive',
			label: 'Belt pitch diameter on the variator (drive)',
			kind: 'number',
			dim: 'length',
			group: 'Pulleys'
		},
		{
			name: 'driven',
			label: 'Belt pitch diameter on the clutch pulley (driven)',
			kind: 'number',
			dim: 'length',
			group: 'Pulleys'
		},
		{
			name: 'centre',
			label: 'Centre distance between the shafts',
			kind: 'number',
			dim: 'length',
			optional: true,
			group: 'Belt'
		}
	]
};

export const DEFAULTS: Record<CalculatorName, Record<Units, FormValues>> = {
	cylinder: {
		metric: {
			bore: '47',
			stroke: '39.2',
			rod: '85',
			chamberCc: '6.5',
			exhaustMode: 'height',
			exhaust: '20.5',
			transferMode: 'height',
			transfer: '29.5',
			rpm: '10000',
			squish: '0.8'
		},
		imperial: {
			bore: '1.8504',
			stroke: '1.5433',
			rod: '3.3465',
			chamberCc: '6.5',
			exhaustMode: 'height',
			exhaust: '0.8071',
			transferMode: 'height',
			transfer: '1.1614',
			rpm: '10000',
			squish: '0.0315'
		}
	},
	gearing: {
		metric: {
			peakRpm: '10500',
			topCvt: '0.82',
			launchCvt: '2.6',
			primaryDriver: '15',
			primaryDriven: '43',
			secondaryDriver: '13',
			secondaryDriven: '47',
			tyre: '120/70-12 51L',
			rollingFactor: '1',
			checkSpeed: '45',
			stockSpeed: '55',
			brakesUpgraded: 'false'
		},
		imperial: {
			peakRpm: '10500',
			topCvt: '0.82',
			launchCvt: '2.6',
			primaryDriver: '15',
			primaryDriven: '43',
			secondaryDriver: '13',
			secondaryDriven: '47',
			tyre: '120/70-12 51L',
			rollingFactor: '1',
			checkSpeed: '28',
			stockSpeed: '34',
			brakesUpgraded: 'false'
		}
	},
	'air-and-jets': {
		metric: {
			elevation: '1400',
			temp: '25',
			humidity: '40',
			pressure: '',
			pressureKind: 'sea-level',
			jet: '92',
			numbering: 'diameter'
		},
		imperial: {
			elevation: '4600',
			temp: '77',
			humidity: '40',
			pressure: '',
			pressureKind: 'sea-level',
			jet: '92',
			numbering: 'diameter'
		}
	},
	retune: {
		metric: {
			jet: '92',
			numbering: 'diameter',
			step: '2',
			fromElevation: '1400',
			fromTemp: '20',
			fromHumidity: '40',
			fromPressure: '',
			fromPressureKind: 'sea-level',
			toElevation: '20',
			toTemp: '12',
			toHumidity: '75',
			toPressure: '',
			toPressureKind: 'sea-level'
		},
		imperial: {
			jet: '92',
			numbering: 'diameter',
			step: '2',
			fromElevation: '4600',
			fromTemp: '68',
			fromHumidity: '40',
			fromPressure: '',
			fromPressureKind: 'sea-level',
			toElevation: '65',
			toTemp: '54',
			toHumidity: '75',
			toPressure: '',
			toPressureKind: 'sea-level'
		}
	},
	// The bench calculators' imperial sheets are their metric ones converted field by field.
	pipe: bothSystems('pipe', { exhaustDuration: '186', rpm: '9500', gasTemp: '' }),
	'time-area': bothSystems('time-area', {
		bore: '47',
		stroke: '39.2',
		rod: '85',
		rpm: '9500',
		exhaustWidth: '30',
		exhaustMode: 'duration',
		exhaust: '186',
		transferWidth: '52',
		transferMode: 'duration',
		transfer: '126'
	}),
	carb: bothSystems('carb', { displacementCc: '68', peakRpm: '9500', k: '0.8' }),
	'dial-gauge': bothSystems('dial-gauge', {
		stroke: '39.2',
		rod: '85',
		mode: 'degrees',
		value: '17',
		stopFirst: '',
		stopSecond: '',
		opens: '',
		closes: ''
	}),
	premix: bothSystems('premix', {
		fuel: '5',
		ratio: '50',
		tank: '',
		currentRatio: '',
		add: '',
		targetRatio: ''
	}),
	belt: bothSystems('belt', { drive: '58', driven: '118', centre: '268' })
};

function bothSystems(name: CalculatorName, metric: FormValues): Record<Units, FormValues> {
	const imperial = { ...metric };
	for (const f of FORMS[name])
		if (f.kind === 'number')
			imperial[f.name] = convertTyped(metric[f.name] ?? '', dimOf(f, metric), 'imperial');
	return { metric, imperial };
}

/**
 * The sheet a link (or a form sent without JavaScript) describes: the defaults of its unit
 * system, then each field the query carries, then `initial` over both. A sent form (one that
 * carries `units`) with a checkbox missing means it was unticked. `switchTo` — the units buttons
 * of a form sent without JavaScript — converts what was typed into the other system.
 */
export function sheetFromQuery(
	name: CalculatorName,
	q: URLSearchParams,
	initial: FormValues = {}
): { units: Units; values: FormValues } {
	let units: Units = q.get('units') === 'imperial' ? 'imperial' : 'metric';
	const fields = FORMS[name];
	const values: FormValues = { ...DEFAULTS[name][units] };
	for (const f of fields) {
		if (q.has(f.name)) values[f.name] = q.get(f.name) ?? '';
		else if (f.kind === 'checkbox' && q.has('units')) values[f.name] = 'false';
	}
	Object.assign(values, initial);
	const to = q.get('switchTo');
	if ((to === 'metric' || to === 'imperial') && to !== units) {
		for (const f of fields)
			if (f.kind === 'number')
				values[f.name] = convertTyped(values[f.name] ?? '', dimOf(f, values), to);
		units = to;
	}
	return { units, values };
}
