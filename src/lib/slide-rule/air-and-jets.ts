import { z } from 'zod';
import * as t from '../tuning';
import { on, row, type CalcResult } from './types';

/** Place and weather, shared with the retune calculator. Pressure: hPa (metric) or inHg (imperial). */
export const placeShape = {
	elevation: z.number().min(-2000).max(40000),
	temp: z.number().min(-60).max(140),
	humidity: z.number().min(0).max(100),
	pressure: z.number().positive().max(1100).optional(),
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

/** The user's place in SI, for the tuning module. `prefix` names fields like "fromElevation". */
export function conditions(p: Place, imperial: boolean, prefix = ''): t.AirConditions {
	const f = (name: string) => (prefix ? prefix + name[0].toUpperCase() + name.slice(1) : name);
	const elevationM = imperial ? t.ftToM(p.elevation) : p.elevation;
	const tempC = on(f('temp'), () => (imperial ? t.fToC(p.temp) : p.temp));
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
	on(f('elevation'), () => t.isaAtmosphere(elevationM));
	on(f('pressure'), () => t.airAt(c));
	return c;
}

export function computeAir(i: AirInput): CalcResult {
	const imp = i.units === 'imperial';
	const c = conditions(i, imp);
	const air = t.airAt(c);
	const dry = t.dryAirPressureKpa(air.pressurePa, c.tempC, c.relativeHumidity);
	const rows = [
		imp
			? row('pressure', 'Pressure at the place', t.kpaToInHg(air.pressurePa / 1000), 'inHg', 2)
			: row('pressure', 'Pressure at the place', air.pressurePa / 100, 'hPa', 1),
		row('density', 'Air density', air.densityKgM3, 'kg/m³', 4),
		row(
			'relativeDensity',
			'Density against ISA sea level',
			(100 * air.densityKgM3) / t.ISA_SEA_LEVEL_DENSITY,
			'%',
			1
		),
		imp
			? row('densityAltitude', 'Density altitude', t.mToFt(air.densityAltitudeM), 'ft', 0)
			: row('densityAltitude', 'Density altitude', air.densityAltitudeM, 'm', 0),
		row(
			'powerCorrection',
			'SAE J1349 power correction factor',
			on('temp', () => t.powerCorrectionFactor(dry, c.tempC)),
			'×',
			3
		)
	];
	const notes = [
		'Pressure left empty means the standard-atmosphere pressure for that elevation. A weather report gives sea-level pressure; a barometer at the place gives station pressure.'
	];
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
			'The sea-level equivalent is the jet that would give the same mixture in ISA sea-level air (1.225 kg/m³), so builds tuned at different places can be compared.'
		);
	}
	return { rows, warnings: [], notes };
}
