import { applyAppGrants } from '../grants';
import type { Migration } from '../migrator';

// Rate-limit counters shared by every app process (rate-limiter-flexible's MySQL store reads and
// writes this table: `key`, `points`, `expire` in ms since the epoch). Keys are hashes of what is
// counted (see auth/limits.ts), so no address or e-mail is kept here.
export const up: Migration = async ({ context: q }) => {
	await q.sequelize.query(`CREATE TABLE rate_limits (
		\`key\` VARCHAR(255) CHARACTER SET ascii NOT NULL PRIMARY KEY,
		points INT NOT NULL DEFAULT 0,
		expire BIGINT UNSIGNED NULL,
		KEY rate_limits_expire (expire)
	)`);
	await applyAppGrants(q);
};

export const down: Migration = async ({ context: q }) => {
	await q.dropTable('rate_limits');
};
