// One description per sheet field: label, section, unit dimension and the range a real engine can
// have (in canonical units). The zod schemas, the forms, the diffs and the display all read it.
import type { Dim } from './units';

export type Option = { value: string; label: string };

export type Field = {
	name: string;
	label: string;
	section: string;
	kind: 'number' | 'int' | 'text' | 'textarea' | 'select' | 'checkbox' | 'date';
	dim?: Dim;
	/** Unit for a dimensionless number (cc, g, rpm, °, turns). */
	unit?: string;
	min?: number;
	max?: number;
	/** Decimals kept for a number without a dimension (default 3; a whole number keeps none). */
	places?: number;
	/** Length limit for text. */
	maxLength?: number;
	options?: Option[];
	/** The value an untouched select takes, shown chosen in the form. Without one a select starts at
	 * nothing chosen ("not recorded"), so an untouched select never saves a guess. */
	preset?: string;
	optional?: boolean;
	/** Known only with the engine open: a stock baseline may publish without it. */
	insideEngine?: boolean;
	hint?: string;
	/** Needed even in a draft (every other non-optional field is needed to publish). */
	always?: boolean;
	/** Extra check on a text value; returns the problem in words, or null. */
	check?: (v: string) => string | null;
};

export function checkLink(v: string): string | null {
	try {
		const u = new URL(v);
		return u.protocol === 'http:' || u.protocol === 'https:' ? null : 'Only http and https links.';
	} catch {
		return 'That is not a full link (it should start with https://).';
	}
}

const opts = (...pairs: [string, string][]): Option[] =>
	pairs.map(([value, label]) => ({ value, label }));

export const EXHAUST_TYPES = opts(
	['stock', 'stock'],
	['sport', 'sport silencer'],
	['expansion-chamber', 'expansion chamber']
);
export const RUN_METHODS = opts(
	['gps-logger', 'GPS logger'],
	['phone-gps', 'phone GPS'],
	['radar', 'radar'],
	['speedometer', 'speedometer']
);
export const VENUES = opts(
	['closed-course', 'closed course'],
	['private-ground', 'private ground'],
	['other', 'other']
);
export const PLUG_READINGS = opts(
	['white', 'white (very lean)'],
	['light-grey', 'light grey (lean)'],
	['tan', 'tan (right)'],
	['brown', 'brown (slightly rich)'],
	['dark-brown', 'dark brown (rich)'],
	['black-wet', 'black / wet (very rich)']
);
export const PART_CATEGORIES = opts(
	['cylinder', 'cylinder kit'],
	['head', 'head'],
	['carburettor', 'carburettor and jets'],
	['intake', 'intake and reeds'],
	['exhaust', 'exhaust'],
	['cvt', 'CVT (variator, rollers, springs, belt)'],
	['clutch', 'clutch'],
	['final-drive', 'final-drive gears'],
	['ignition', 'ignition'],
	['crank', 'crank and bearings'],
	['tyres-brakes', 'tyres and brakes'],
	['tools', 'tools and consumables'],
	['other', 'other']
);
export const CURRENCIES = opts(
	['EUR', 'EUR (€)'],
	['GBP', 'GBP (£)'],
	['USD', 'USD ($)'],
	['CHF', 'CHF'],
	['SEK', 'SEK'],
	['PLN', 'PLN'],
	['CAD', 'CAD'],
	['AUD', 'AUD']
);

export const BUILD_FIELDS: Field[] = [
	{
		name: 'title',
		label: 'Title',
		section: 'Build',
		kind: 'text',
		maxLength: 120,
		min: 3,
		always: true
	},
	{
		name: 'chassis',
		label: 'Chassis (frame, wheel size, year)',
		section: 'Build',
		kind: 'text',
		maxLength: 160
	},
	{
		name: 'engineFamily',
		label: 'Engine family',
		section: 'Build',
		kind: 'text',
		maxLength: 120,
		hint: 'e.g. horizontal 50 cc two-stroke, 12-inch wheel frame'
	},
	{
		name: 'engineCycle',
		label: 'Cycle',
		section: 'Build',
		kind: 'select',
		preset: 'two-stroke',
		options: opts(['two-stroke', 'two-stroke'], ['four-stroke', 'four-stroke'])
	},
	{
		name: 'cooling',
		label: 'Cooling',
		section: 'Build',
		kind: 'select',
		preset: 'air',
		options: opts(['air', 'air-cooled'], ['liquid', 'liquid-cooled'])
	},
	{
		name: 'cylinderOrientation',
		label: 'Cylinder',
		section: 'Build',
		kind: 'select',
		preset: 'horizontal',
		options: opts(['horizontal', 'horizontal'], ['vertical', 'vertical'])
	},
	{ name: 'brakeFront', label: 'Front brake', section: 'Brakes', kind: 'text', maxLength: 120 },
	{ name: 'brakeRear', label: 'Rear brake', section: 'Brakes', kind: 'text', maxLength: 120 },
	{
		name: 'brakesUpgraded',
		label: 'Brakes upgraded for the extra speed',
		section: 'Brakes',
		kind: 'checkbox'
	},
	{
		name: 'currency',
		label: 'Currency of the parts list',
		section: 'Build',
		kind: 'select',
		preset: 'EUR',
		options: CURRENCIES
	},
	{
		name: 'story',
		label: 'The story (Markdown)',
		section: 'Story',
		kind: 'textarea',
		maxLength: 20000,
		optional: true
	}
];

export const PART_FIELDS: Field[] = [
	{
		name: 'category',
		label: 'Category',
		section: 'Part',
		kind: 'select',
		options: PART_CATEGORIES
	},
	{
		name: 'name',
		label: 'Part',
		section: 'Part',
		kind: 'text',
		maxLength: 160,
		min: 2,
		always: true
	},
	{
		name: 'cost',
		label: 'Cost',
		section: 'Part',
		kind: 'number',
		min: 0,
		max: 100000,
		hint: 'In the build’s currency, e.g. 89.90'
	},
	{
		name: 'link',
		label: 'Link (http or https)',
		section: 'Part',
		kind: 'text',
		maxLength: 500,
		optional: true,
		check: checkLink
	},
	{
		name: 'setupId',
		label: 'First fitted in setup',
		section: 'Part',
		kind: 'select',
		options: [],
		optional: true
	}
];
