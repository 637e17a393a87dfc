import { z } from 'zod';
import * as t from '../tuning';
import { FieldError, fmt, on, row, type CalcResult } from './types';

const teeth = z
	.number()
	.int({ error: 'Teeth are counted in whole numbers: type the number stamped on the gear.' })
	.positive()
	.max(200);

export const gearingSchema = z.object({
	units: z.enum(['metric', 'imperial']),
	peakRpm: z.number().positive().max(30000),
	topCvt: z.number().positive().max(5),
	launchCvt: z.number().positive().max(5).optional(),
	primaryDriver: teeth,
	primaryDriven: teeth,
	secondaryDriver: teeth.optional(),
	secondaryDriven: teeth.optional(),
	tyre: z.string().trim().min(4).max(40),
	rollingFactor: z.number().min(0.8).max(1.1).default(1),
	checkSpeed: z.number().positive().max(400).optional(),
	stockSpeed: z.number().positive().max(400).optional(),
	brakesUpgraded: z.boolean().default(false)
});
export type GearingInput = z.infer<typeof gearingSchema>;

export function computeGearing(i: GearingInput): CalcResult {
	const imp = i.units === 'imperial';
	const speedUnit = imp ? 'mph' : 'km/h';
	const fromKmh = (v: number) => (imp ? t.kmhToMph(v) : v);
	const toKmh = (v: number) => (imp ? t.mphToKmh(v) : v);
	const stages: t.GearStage[] = [[i.primaryDriver, i.primaryDriven]];
	if ((i.secondaryDriver === undefined) !== (i.secondaryDriven === undefined)) {
		throw new FieldError(
			i.secondaryDriver === undefined ? 'secondaryDriver' : 'secondaryDriven',
			'Give both teeth counts of the second stage, or neither.'
		);
	}
	if (i.secondaryDriver !== undefined && i.secondaryDriven !== undefined)
		stages.push([i.secondaryDriver, i.secondaryDriven]);

	const tyre = on('tyre', () => t.parseTyre(i.tyre));
	const diameter = t.tyreDiameterMm(i.tyre);
	const circumference = t.tyreCircumferenceMm(i.tyre, i.rollingFactor);
	const fd = t.finalDriveRatio(stages);
	const top = t.overallReduction(i.topCvt, stages);
	const topKmh = t.gearingLimitedSpeedKmh(i.peakRpm, i.topCvt, stages, i.tyre, i.rollingFactor);
	const speedText = (kmh: number) => `${fmt(fromKmh(kmh), 0)} ${speedUnit}`;
	const rows = [
		row('finalDrive', 'Final drive ratio', fd, ': 1', 3, t.plausibilityNote('finalDriveRatio', fd)),
		row('overallTop', 'Overall reduction at top CVT ratio', top, ': 1', 3),
		imp
			? row('tyreDiameter', 'Tyre diameter', t.mmToIn(diameter), 'in', 2)
			: row('tyreDiameter', 'Tyre diameter', diameter, 'mm', 1),
		imp
			? row('circumference', 'Rolling circumference', t.mmToIn(circumference), 'in', 2)
			: row('circumference', 'Rolling circumference', circumference, 'mm', 1),
		row(
			'topSpeed',
			'Gearing-limited speed at peak rpm',
			fromKmh(topKmh),
			speedUnit,
			1,
			t.plausibilityNote('topCvtRatio', i.topCvt, (x) => `${fmt(x)} : 1`) ??
				t.plausibilityNote('rpm', i.peakRpm, (x) => `${fmt(x)} rpm`) ??
				t.plausibilityNote('speedKmh', topKmh, speedText)
		)
	];
	if (i.launchCvt !== undefined) {
		const launch = t.overallReduction(i.launchCvt, stages);
		rows.push(
			row(
				'overallLaunch',
				'Overall reduction at launch CVT ratio',
				launch,
				': 1',
				3,
				t.plausibilityNote('launchCvtRatio', i.launchCvt)
			)
		);
		rows.push(
			row(
				'launchSpeed',
				'Speed at peak rpm on the launch ratio',
				fromKmh(t.roadSpeedKmh(i.peakRpm, launch, circumference)),
				speedUnit,
				1
			)
		);
	}
	if (i.checkSpeed !== undefined) {
		rows.push(
			row(
				'rpmAtCheck',
				`Engine speed at ${i.checkSpeed} ${speedUnit} (top ratio)`,
				t.rpmAtSpeed(toKmh(i.checkSpeed), top, circumference),
				'rpm',
				0
			)
		);
	}
	const notes = [
		'The gearing-limited speed ignores drag and power: it is a ceiling, not a promise.'
	];
	if (tyre.approximate)
		notes.push(
			'Inch tyre sizes carry no aspect ratio; 100 % is assumed, so the diameter is approximate.'
		);
	if (tyre.loadIndex !== undefined) {
		const kg = t.loadIndexKg(tyre.loadIndex);
		if (kg !== undefined)
			rows.push(
				imp
					? row('tyreLoad', `Tyre load index ${tyre.loadIndex}`, t.kgToLb(kg), 'lb', 0)
					: row('tyreLoad', `Tyre load index ${tyre.loadIndex}`, kg, 'kg', 0)
			);
		else notes.push(`Load index ${tyre.loadIndex}: read its load off the maker's table.`);
	}
	const marked = [
		tyre.construction && `${tyre.construction} construction`,
		tyre.tubeless !== undefined && (tyre.tubeless ? 'tubeless (TL)' : 'tube type (TT)'),
		tyre.reinforced && 'reinforced'
	].filter(Boolean);
	if (marked.length) notes.push(`The marking also says: ${marked.join(', ')}.`);
	if (tyre.speedSymbol) {
		const rated = t.speedSymbolKmh(tyre.speedSymbol);
		rows.push(
			row('tyreRating', `Tyre speed symbol ${tyre.speedSymbol}`, fromKmh(rated), speedUnit, 0)
		);
	} else
		notes.push(
			'No speed symbol in the tyre size: read it off the sidewall (e.g. 51J) to check the tyre is rated for this speed.'
		);
	const warnings = t.speedWarnings({
		gearingLimitedKmh: topKmh,
		tyreSpeedSymbol: tyre.speedSymbol,
		stockKmh: i.stockSpeed === undefined ? undefined : toKmh(i.stockSpeed),
		brakesUpgraded: i.brakesUpgraded,
		units: i.units
	});
	return { rows, warnings, notes };
}
