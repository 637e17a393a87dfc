import { api } from '$lib/server/api';
import * as runs from '$lib/server/sheet/runs';
import * as setups from '$lib/server/sheet/setups';
import { readBuild, seesTakenDown } from '$lib/server/sheet/access';
import type { RequestHandler } from './$types';

const cell = (v: unknown) => {
	const s = v === null || v === undefined ? '' : String(v);
	// Quote per RFC 4180, and defuse spreadsheet formulas in text cells.
	const safe = /^[=+\-@]/.test(s) && Number.isNaN(Number(s)) ? `'${s}` : s;
	return /[",\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
};

export const GET: RequestHandler = api(async (event) => {
	const { build } = await readBuild(event, Number(event.params.id));
	const [setupRows, runRows] = await Promise.all([
		setups.listForBuild(build.id),
		runs.listForBuild(build.id)
	]);
	const shown = seesTakenDown(event, build)
		? setupRows
		: setupRows.filter((s) => s.moderation !== 'hidden');
	const byId = new Map(shown.map((s) => [s.id, s]));
	const head = [
		'run_date',
		'speed_kmh',
		'method',
		'two_way',
		'venue',
		'elevation_m',
		'temp_c',
		'humidity_pct',
		'pressure_kpa',
		'air_density_kg_m3',
		'density_altitude_m',
		'sea_level_jet',
		'setup',
		'setup_change',
		'displacement_cc',
		'exhaust',
		'main_jet',
		'final_drive_ratio',
		'overall_ratio',
		'roller_total_g',
		'gearing_limit_kmh'
	];
	const lines = runRows
		.filter((r) => byId.has(r.setupId))
		.map((r) => {
			const s = byId.get(r.setupId)!;
			return [
				r.runOn,
				r.speedKmh,
				r.method,
				r.twoWay,
				r.venue,
				r.elevationM,
				r.tempC,
				r.humidityPct,
				r.pressureKpa,
				r.airDensity,
				r.densityAltitudeM,
				r.seaLevelJet,
				s.position,
				s.changeNote,
				s.displacementCc,
				s.exhaustType,
				s.mainJet,
				s.finalDriveRatio,
				s.overallRatio,
				s.rollerTotalG,
				s.gearingLimitKmh
			]
				.map(cell)
				.join(',');
		});
	return new Response([head.join(','), ...lines].join('\r\n') + '\r\n', {
		headers: {
			'content-type': 'text/csv; charset=utf-8',
			'content-disposition': `attachment; filename="build-${build.id}-runs.csv"`
		}
	});
});
