// A primary and one replica with MariaDB's own GTID replication, both project-local on loopback.
// The primary writes a binary log; the replica starts from an empty data folder whenever the
// primary's is new (a new history), and otherwise resumes where it stopped.
import fs from 'node:fs';
import { fail } from './install.js';
import { rootSql, startMariadb } from './mariadb.js';

const q = (s) => String(s).replace(/[`'\\]/g, '');

export async function startPrimary(e) {
	const primary = await startMariadb(e, {
		wipe: e.WIPE_DB === '1',
		extra: ['--server-id=1', '--log-bin=primary-bin', '--binlog-format=ROW', '--gtid-strict-mode=1']
	});
	const [user, pw] = [q(e.DB_REPL_USER), q(e.DB_REPL_PASSWORD)];
	const ok = await rootSql(
		primary.socket,
		[
			`CREATE USER IF NOT EXISTS '${user}'@'127.0.0.1' IDENTIFIED BY '${pw}'`,
			`ALTER USER '${user}'@'127.0.0.1' IDENTIFIED BY '${pw}'`,
			`GRANT REPLICATION SLAVE ON *.* TO '${user}'@'127.0.0.1'`
		].join('; ')
	);
	if (!ok)
		fail('could not create the replication account on the primary', 'See the message above.');
	return primary;
}

export async function startReplica(e, primary) {
	const dir = e.DB_REPLICA_DATA_DIR;
	const wipe = primary.fresh || e.WIPE_DB === '1' || !fs.existsSync(dir);
	const replica = await startMariadb(e, {
		dir,
		port: e.DB_REPLICA_PORT,
		wipe,
		create: false,
		extra: ['--server-id=2', '--read-only=1', '--relay-log=replica-relay', '--gtid-strict-mode=1']
	});
	if (wipe || replica.fresh) {
		const ok = await rootSql(
			replica.socket,
			[
				"SET GLOBAL gtid_slave_pos = ''",
				`CHANGE MASTER TO MASTER_HOST='127.0.0.1', MASTER_PORT=${Number(e.DB_PORT)},
				 MASTER_USER='${q(e.DB_REPL_USER)}', MASTER_PASSWORD='${q(e.DB_REPL_PASSWORD)}',
				 MASTER_USE_GTID=slave_pos, MASTER_CONNECT_RETRY=1`,
				'START SLAVE'
			].join('; ')
		);
		if (!ok) fail('could not start replication on the replica', 'See the message above.');
	}
	return replica;
}
