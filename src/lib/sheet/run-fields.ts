import { PLUG_READINGS, RUN_METHODS, VENUES, type Field } from './fields';

export const RUN_FIELDS: Field[] = [
	{ name: 'runOn', label: 'Date', section: 'Run', kind: 'date' },
	{
		name: 'speed',
		label: 'Top speed',
		section: 'Run',
		kind: 'number',
		dim: 'speed',
		min: 5,
		max: 250
	},
	{ name: 'method', label: 'Measured with', section: 'Run', kind: 'select', options: RUN_METHODS },
	{ name: 'twoWay', label: 'Two-way average on flat ground', section: 'Run', kind: 'checkbox' },
	{
		name: 'venue',
		label: 'Where',
		section: 'Run',
		kind: 'select',
		options: VENUES,
		hint: 'Never make speed runs on public roads.',
		optional: true
	},
	{
		name: 'elevation',
		label: 'Site elevation',
		section: 'Air',
		kind: 'number',
		dim: 'elevation',
		min: -450,
		max: 5500,
		optional: true
	},
	{
		name: 'temp',
		label: 'Air temperature',
		section: 'Air',
		kind: 'number',
		dim: 'temp',
		min: -40,
		max: 55,
		optional: true
	},
	{
		name: 'humidity',
		label: 'Relative humidity',
		section: 'Air',
		kind: 'number',
		unit: '%',
		min: 0,
		max: 100,
		optional: true
	},
	{
		name: 'pressure',
		label: 'Barometric pressure',
		section: 'Air',
		kind: 'number',
		dim: 'pressure',
		min: 50,
		max: 110,
		optional: true
	},
	{
		name: 'pressureKind',
		label: 'That pressure is',
		section: 'Air',
		kind: 'select',
		preset: 'sea-level',
		options: [
			{ value: 'sea-level', label: 'a sea-level reading' },
			{ value: 'station', label: 'measured at the site' }
		]
	},
	{
		name: 'chtCruise',
		label: 'Head temperature, cruising',
		section: 'Engine',
		kind: 'number',
		dim: 'temp',
		min: 40,
		max: 350,
		optional: true
	},
	{
		name: 'chtFull',
		label: 'Head temperature, full throttle',
		section: 'Engine',
		kind: 'number',
		dim: 'temp',
		min: 40,
		max: 350,
		optional: true
	},
	{
		name: 'chtSensor',
		label: 'Temperature sensor',
		section: 'Engine',
		kind: 'select',
		preset: 'plug-washer',
		options: [
			{ value: 'plug-washer', label: 'under the plug' },
			{ value: 'head-stud', label: 'on a head stud' },
			{ value: 'coolant', label: 'coolant' }
		]
	},
	{
		name: 'riderMass',
		label: 'Rider plus gear',
		section: 'Engine',
		kind: 'number',
		dim: 'mass',
		min: 30,
		max: 200,
		optional: true
	},
	{
		name: 'accelSeconds',
		label: 'Acceleration time',
		section: 'Engine',
		kind: 'number',
		unit: 's',
		min: 1,
		max: 60,
		optional: true
	},
	{
		name: 'accelTarget',
		label: 'Acceleration from 0 to',
		section: 'Engine',
		kind: 'number',
		dim: 'speed',
		min: 10,
		max: 150,
		optional: true
	},
	{
		name: 'plugReading',
		label: 'Spark plug after the run',
		section: 'Engine',
		kind: 'select',
		options: [{ value: '', label: 'not read' }, ...PLUG_READINGS],
		optional: true
	},
	{ name: 'breakIn', label: 'Break-in run', section: 'Engine', kind: 'checkbox' },
	{
		name: 'heatCycles',
		label: 'Heat cycles so far',
		section: 'Engine',
		kind: 'int',
		min: 0,
		max: 1000,
		optional: true
	},
	{
		name: 'notes',
		label: 'Notes',
		section: 'Notes',
		kind: 'textarea',
		maxLength: 2000,
		optional: true
	}
];
