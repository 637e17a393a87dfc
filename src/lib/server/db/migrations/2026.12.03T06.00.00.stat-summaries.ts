import { applyAppGrants } from '../grants';
import type { Migration } from '../migrator';
import { MARK_COLUMNS, fillStatements } from '../../../stats/summary-sql';

// Summaries for the two aggregates that read every build: the speed map's bins and change
// effects' counts, kept on every write in the same transaction as the change (see
// src/lib/stats/summary-sql.ts), so a read costs what the number of bins costs, not the number of
// builds. stat_marks keeps each build's setup columns as they were last added, to take them away.
export const up: Migration = async ({ context: q }) => {
	const s = q.sequelize;
	// The same column types as setups (the generated pipe column becomes a plain copy).
	await s.query(
		`CREATE TABLE stat_marks AS SELECT ${MARK_COLUMNS.join(', ')} FROM setups WHERE 1 = 0`
	);
	await s.query(
		'ALTER TABLE stat_marks ADD PRIMARY KEY (id), ADD INDEX stat_marks_build (build_id)'
	);
	// Engine families by number, for the bins' keys; names compare as setups.engine_family does.
	await s.query(`CREATE TABLE summary_families (
		id INT NOT NULL AUTO_INCREMENT PRIMARY KEY, name VARCHAR(120) NOT NULL,
		UNIQUE KEY summary_families_name (name)
	)`);
	// Codes as src/lib/stats/summary-sql.ts numbers them (0 = any).
	await s.query(`CREATE TABLE speed_map_bins (
		axis TINYINT NOT NULL, method TINYINT NOT NULL, cycle TINYINT NOT NULL, family INT NOT NULL,
		two_way TINYINT NOT NULL, venue TINYINT NOT NULL, xb INT NOT NULL, yb SMALLINT NOT NULL,
		pipe TINYINT NOT NULL,
		n INT NOT NULL, sx DOUBLE NOT NULL, sy DOUBLE NOT NULL, sxx DOUBLE NOT NULL,
		sxy DOUBLE NOT NULL, syy DOUBLE NOT NULL, lo DOUBLE NULL, hi DOUBLE NULL,
		PRIMARY KEY (axis, method, cycle, family, two_way, venue, xb, yb, pipe)
	)`);
	await s.query(`CREATE TABLE effect_counts (
		kind VARCHAR(20) NOT NULL, grain TINYINT NOT NULL, v INT NOT NULL, n INT NOT NULL,
		PRIMARY KEY (kind, grain, v)
	)`);
	// Moved on by every listing refresh: answers kept per process are valid while it stands still.
	await s.query(
		'CREATE TABLE summary_version (id TINYINT NOT NULL PRIMARY KEY, v BIGINT NOT NULL)'
	);
	await s.query('INSERT INTO summary_version (id, v) VALUES (1, 0)');
	for (const sql of fillStatements()) await s.query(sql);
	await applyAppGrants(q);
};

export const down: Migration = async ({ context: q }) => {
	for (const t of [
		'summary_version',
		'effect_counts',
		'speed_map_bins',
		'summary_families',
		'stat_marks'
	])
		await q.dropTable(t);
};
