import { z } from 'zod';
import * as t from '../tuning';
import { FieldError, fmt, on, row, within, type CalcResult, type ResultRow } from './types';

/** Place and weather, shared with the retune calculator. Ranges are checked in the reader's units. */
export const placeShape = {
	elevation: z.number(),
	temp: z.number(),
	humidity: z.number().min(0).max(100),
	pressure: z.number().positive().optional(),
	pressureKind: z.enum(['station', 'sea-level']).default('sea-level')
};

export const airSchema = z.object({
	units: z.enum(['metric', 'imperial']),
	...placeShape,
	jet: z.number().positive().max(1000).optional(),
	numbering: z.enum(['diameter', 'flow']).default('diameter')
});
export type AirInput = z.infer<typeof airSchema>;

export type Place = {
	elevation: number;
	temp: number;
	humidity: number;
	pressure?: number;
	pressureKind: 'station' | 'sea-level';
};

// Where air calculations hold, in each unit system: the standard atmosphere's troposphere,
// weather a scooter is ridden in, and the barometer readings found on Earth (a sea-level
// reading lies within about 870–1085 hPa; a station reading falls with the elevation).
const RANGES = {
	metric: {
		elevation: [-500, 9000, 'm'],
		temp: [-40, 60, '°C'],
		'sea-level': [850, 1090, 'hPa'],
		station: [300, 1090, 'hPa']
	},
	imperial: {
		elevation: [-1640, 29500, 'ft'],
		temp: [-40, 140, '°F'],
		'sea-level': [25.1, 32.19, 'inHg'],
		station: [8.86, 32.19, 'inHg']
	}
} as const;

/**
 * The reader's place in SI, for the tuning module. `prefix` names fields like "fromElevation".
 * Every check runs in the units the reader typed, on the field they typed, before any SI maths.
 */
export function conditions(p: Place, imperial: boolean, prefix = ''): t.AirConditions {
	const f = (name: string) => (prefix ? prefix + name[0].toUpperCase() + name.slice(1) : name);
	const r = RANGES[imperial ? 'imperial' : 'metric'];
	within(f('elevation'), p.elevation, r.elevation[0], r.elevation[1], r.elevation[2]);
	within(f('temp'), p.temp, r.temp[0], r.temp[1], r.temp[2]);
	if (p.pressure !== undefined) {
		const [lo, hi, unit] = r[p.pressureKind];
		if (p.pressure < lo || p.pressure > hi) {
			const other = imperial
				? p.pressure > 800
					? ' That looks like hPa: switch to metric, or type inches of mercury.'
					: ''
				: p.pressure >= 20 && p.pressure <= 35
					? ' That looks like inches of mercury: switch to imperial, or type hPa.'
					: '';
			throw new FieldError(
				f('pressure'),
				`Must be between ${fmt(lo)} and ${fmt(hi)} ${unit} for a ${p.pressureKind === 'station' ? 'reading at the place' : 'sea-level reading'}.${other}`
			);
		}
	}
	const elevationM = imperial ? t.ftToM(p.elevation) : p.elevation;
	const tempC = imperial ? t.fToC(p.temp) : p.temp;
	const pressurePa =
		p.pressure === undefined
			? undefined
			: imperial
				? t.inHgToKpa(p.pressure) * 1000
				: p.pressure * 100;
	const c: t.AirConditions = {
		elevationM,
		tempC,
		relativeHumidity: p.humidity / 100,
		pressureKind: p.pressureKind
	};
	if (pressurePa !== undefined) c.pressurePa = pressurePa;
	// What is left (a station pressure under the vapour pressure) belongs to the pressure field.
	on(f(p.pressure === undefined ? 'humidity' : 'pressure'), () => t.airAt(c));
	return c;
}

/**
 * The rows that describe one place's air, in the reader's units. With `key`, they are one of the
 * retune's two places: the dry-air density is its answer, the rest working (off the print).
 */
export function airRows(air: t.Air, imp: boolean, key = '', label = ''): ResultRow[] {
	const k = (s: string) => (key ? key + s[0].toUpperCase() + s.slice(1) : s);
	const l = (s: string) => (label ? `${s}, ${label}` : s);
	const detail = (r: ResultRow): ResultRow => (key ? { ...r, detail: true } : r);
	return [
		detail(
			imp
				? row(
						k('pressure'),
						l('Pressure at the place'),
						t.kpaToInHg(air.pressurePa / 1000),
						'inHg',
						2
					)
				: row(k('pressure'), l('Pressure at the place'), air.pressurePa / 100, 'hPa', 1)
		),
		detail(
			imp
				? row(
						k('vapour'),
						l('Water vapour pressure'),
						t.kpaToInHg(air.vapourPressurePa / 1000),
						'inHg',
						3
					)
				: row(k('vapour'), l('Water vapour pressure'), air.vapourPressurePa / 100, 'hPa', 1)
		),
		row(k('dryDensity'), l('Dry-air density (what burns)'), air.dryDensityKgM3, 'kg/m³', 4),
		detail(row(k('density'), l('Air density, dry air and vapour'), air.densityKgM3, 'kg/m³', 4))
	];
}

export function computeAir(i: AirInput): CalcResult {
	const imp = i.units === 'imperial';
	const c = conditions(i, imp);
	const air = t.airAt(c);
	const rows = [
		...airRows(air, imp),
		row(
			'relativeDensity',
			'Density against ISA sea level',
			(100 * air.densityKgM3) / t.ISA_SEA_LEVEL_DENSITY,
			'%',
			1
		),
		imp
			? row('densityAltitude', 'Density altitude', t.mToFt(air.densityAltitudeM), 'ft', 0)
			: row('densityAltitude', 'Density altitude', air.densityAltitudeM, 'm', 0)
	];
	const notes = [
		'Pressure left empty means the standard-atmosphere pressure for that elevation. A weather report gives sea-level pressure; a barometer at the place gives station pressure.'
	];
	// SAE J1349 is defined near its 99 kPa, 25 °C reference; far from it the factor means little.
	const dryKpa = (air.pressurePa - air.vapourPressurePa) / 1000;
	if (dryKpa >= 50 && dryKpa <= 110 && c.tempC >= -40 && c.tempC <= 60)
		rows.push(
			row(
				'powerCorrection',
				'SAE J1349 power correction factor',
				t.powerCorrectionFactor(dryKpa, c.tempC),
				'×',
				3
			)
		);
	else
		notes.push(
			'No SAE J1349 power correction here: the dry-air pressure is outside 50–110 kPa, far from the standard’s 99 kPa reference.'
		);
	if (i.jet !== undefined) {
		rows.push(
			row(
				'seaLevelJet',
				'Sea-level-equivalent main jet',
				t.seaLevelEquivalentJet(i.jet, c, i.numbering),
				'',
				1
			)
		);
		notes.push(
			'The sea-level equivalent is the jet that would hold the same fuel to dry air in ISA sea-level air (15 °C, 1013.25 hPa, dry: 1.225 kg/m³), so builds tuned at different places compare.'
		);
	}
	return { rows, warnings: [], notes };
}
