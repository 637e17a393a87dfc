import { QueryTypes } from 'sequelize';
import type { Migration } from '../migrator';
import { deriveRun } from '../../../sheet/derive';
import { fillStatements } from '../../../stats/summary-sql';

// The sea-level-equivalent jet now holds fuel to the dry air the engine burns (jetting.ts,
// retargetJetForAir), so humid runs move further than before. Every stored value is worked out
// again from its run and setup, each setup takes its best run's value, and the speed map's bins
// (whose jet axis reads these columns) are filled again from the corrected setups.
export const up: Migration = async ({ context: q }) => {
	const s = q.sequelize;
	let after = 0;
	for (;;) {
		const rows = await s.query<{
			id: number;
			elevation_m: number;
			temp_c: number;
			humidity_pct: number;
			pressure_kpa: number | null;
			pressure_kind: 'sea-level' | 'station';
			config: unknown;
		}>(
			`SELECT r.id, r.elevation_m, r.temp_c, r.humidity_pct, r.pressure_kpa, r.pressure_kind, s.config
			FROM runs r JOIN setups s ON s.id = r.setup_id WHERE r.id > :after ORDER BY r.id LIMIT 2000`,
			{ replacements: { after }, type: QueryTypes.SELECT }
		);
		if (!rows.length) break;
		after = rows[rows.length - 1].id;
		const pairs = rows.map((r) => {
			const config = typeof r.config === 'string' ? JSON.parse(r.config) : r.config;
			const jet = deriveRun(
				{
					elevationM: r.elevation_m,
					tempC: r.temp_c,
					humidityPct: r.humidity_pct,
					pressureKpa: r.pressure_kpa,
					pressureKind: r.pressure_kind
				},
				config ?? {}
			).seaLevelJet;
			return [r.id, jet];
		});
		const values = pairs.map(() => 'SELECT ? AS id, ? AS jet').join(' UNION ALL ');
		await s.query(`UPDATE runs r JOIN (${values}) v ON v.id = r.id SET r.sea_level_jet = v.jet`, {
			replacements: pairs.flat()
		});
	}
	await s.query(
		`UPDATE setups s JOIN runs r ON r.id = s.best_run_id SET s.sea_level_jet = r.sea_level_jet`
	);
	for (const t of ['speed_map_bins', 'effect_counts', 'stat_marks'])
		await s.query(`DELETE FROM ${t}`);
	for (const sql of fillStatements()) await s.query(sql);
	await s.query('UPDATE summary_version SET v = v + 1 WHERE id = 1');
};

// The old values are not kept: going down leaves the corrected ones, which the old code reads.
export const down: Migration = async () => {};
