// Every derived number on a build sheet, from the tuning module. Missing inputs give null.
import * as t from '../tuning';
import { rollerTotal } from './rollers';
import { DEFAULT_TOP_CVT } from './setup-fields';

export type Config = Record<string, string | number | boolean | null | undefined>;
const num = (c: Config, k: string) =>
	typeof c[k] === 'number' && Number.isFinite(c[k]) ? (c[k] as number) : null;
const str = (c: Config, k: string) =>
	typeof c[k] === 'string' && c[k] !== '' ? (c[k] as string) : null;
const safe = <T>(fn: () => T): T | null => {
	try {
		return fn();
	} catch (e) {
		if (e instanceof RangeError) return null;
		throw e;
	}
};

export type SetupDerived = {
	displacementCc: number | null;
	compressionRatio: number | null;
	trappedCompressionRatio: number | null;
	exhaustDuration: number | null;
	exhaustHeight: number | null;
	transferDuration: number | null;
	transferHeight: number | null;
	finalDriveRatio: number | null;
	topCvtRatio: number;
	topCvtAssumed: boolean;
	overallRatio: number | null;
	tyreCircumferenceMm: number | null;
	tyreSpeedSymbol: string | null;
	gearingLimitKmh: number | null;
	rollerTotalG: number | null;
};

export function gearStages(c: Config): t.GearStage[] | null {
	const a = num(c, 'primaryDriver');
	const b = num(c, 'primaryDriven');
	if (a === null || b === null) return null;
	const stages: t.GearStage[] = [[a, b]];
	const x = num(c, 'secondaryDriver');
	const y = num(c, 'secondaryDriven');
	if (x !== null && y !== null) stages.push([x, y]);
	return stages;
}

export function deriveSetup(c: Config): SetupDerived {
	const bore = num(c, 'bore');
	const stroke = num(c, 'stroke');
	const rod = num(c, 'rod');
	const chamber = num(c, 'chamberCc');
	const displacementCc = bore && stroke ? safe(() => t.displacementCc(bore, stroke)) : null;
	const port = (durKey: string, hKey: string) => {
		const d = num(c, durKey);
		const h = num(c, hKey);
		if (!stroke || !rod) return { duration: d, height: h };
		if (h !== null) return { duration: safe(() => t.portDurationDeg(h, stroke, rod)), height: h };
		if (d !== null)
			return { duration: d, height: safe(() => t.portTopForDurationDeg(d, stroke, rod)) };
		return { duration: null, height: null };
	};
	const ex = port('exhaustDuration', 'exhaustHeight');
	const tr = port('transferDuration', 'transferHeight');
	const stages = gearStages(c);
	const measuredTop = num(c, 'topCvtRatio');
	const topCvtRatio = measuredTop ?? DEFAULT_TOP_CVT;
	const tyre = str(c, 'rearTyre');
	const parsed = tyre ? safe(() => t.parseTyre(tyre)) : null;
	const circumference = tyre ? safe(() => t.tyreCircumferenceMm(tyre)) : null;
	const overall = stages ? safe(() => t.overallReduction(topCvtRatio, stages)) : null;
	const peak = num(c, 'peakRpm');
	return {
		displacementCc,
		compressionRatio:
			displacementCc && chamber
				? t.geometricCompressionRatio(displacementCc, chamber)
				: num(c, 'compressionMeasured'),
		trappedCompressionRatio:
			bore && stroke && chamber && ex.height
				? safe(() => t.trappedCompressionRatio(bore, stroke, ex.height!, chamber))
				: null,
		exhaustDuration: ex.duration,
		exhaustHeight: ex.height,
		transferDuration: tr.duration,
		transferHeight: tr.height,
		finalDriveRatio: stages ? safe(() => t.finalDriveRatio(stages)) : null,
		topCvtRatio,
		topCvtAssumed: measuredTop === null,
		overallRatio: overall,
		tyreCircumferenceMm: circumference,
		tyreSpeedSymbol: (str(c, 'tyreSpeedSymbol')?.toUpperCase() ?? parsed?.speedSymbol) || null,
		gearingLimitKmh:
			peak && overall && circumference
				? safe(() => t.roadSpeedKmh(peak, overall, circumference))
				: null,
		rollerTotalG: rollerTotal(str(c, 'rollerWeights'))
	};
}

export type RunAir = {
	elevationM: number | null;
	tempC: number | null;
	humidityPct: number | null;
	pressureKpa: number | null;
	pressureKind: 'sea-level' | 'station';
};

/** The run's air for the formulas, or null while its place and air are not recorded. */
export function runConditions(r: RunAir): t.AirConditions | null {
	if (r.elevationM === null || r.tempC === null || r.humidityPct === null) return null;
	const c: t.AirConditions = {
		elevationM: r.elevationM,
		tempC: r.tempC,
		relativeHumidity: r.humidityPct / 100,
		pressureKind: r.pressureKind
	};
	if (r.pressureKpa !== null) c.pressurePa = r.pressureKpa * 1000;
	return c;
}

export function deriveRun(r: RunAir, c: Config) {
	const conditions = runConditions(r);
	if (!conditions) return { airDensity: null, densityAltitudeM: null, seaLevelJet: null };
	const air = safe(() => t.airAt(conditions));
	const jet = num(c, 'mainJet');
	const numbering = str(c, 'jetNumbering') === 'flow' ? 'flow' : 'diameter';
	return {
		airDensity: air?.densityKgM3 ?? null,
		densityAltitudeM: air?.densityAltitudeM ?? null,
		seaLevelJet: jet ? safe(() => t.seaLevelEquivalentJet(jet, conditions, numbering)) : null
	};
}

/** The sheet's safety warnings for one setup and its best run. */
export function setupWarnings(
	d: SetupDerived,
	best: { speedKmh: number; chtFullC: number | null; chtSensor: t.HeadTempSensor } | null,
	stockKmh: number | null,
	brakesUpgraded: boolean
): t.SpeedWarning[] {
	return (
		safe(() =>
			t.speedWarnings({
				measuredKmh: best?.speedKmh,
				gearingLimitedKmh: d.gearingLimitKmh ?? undefined,
				tyreSpeedSymbol: d.tyreSpeedSymbol ?? undefined,
				stockKmh: stockKmh ?? undefined,
				brakesUpgraded,
				headTempC: best?.chtFullC ?? undefined,
				headTempSensor: best?.chtSensor
			})
		) ?? []
	);
}
