import type { Connection } from 'mariadb';
import { db } from './connection';

// rate-limiter-flexible's MySQL store speaks the `mysql` driver's dialect: callbacks, and `??`
// for identifiers beside `?` for values. This is that client over Sequelize's own pool (always
// the primary: counters are written), so the limiter needs no second pool and no second set of
// settings. Identifiers come from our own options (database and table names), never from input.

type Callback = (err: unknown, rows?: unknown) => void;

const ident = (s: unknown) => `\`${String(s).replace(/`/g, '``')}\``;

/** `??` → a quoted identifier and `?` → kept, taking values from the list in order. */
export function identifiersInline(sql: string, values: unknown[]): [string, unknown[]] {
	const rest: unknown[] = [];
	let i = 0;
	const text = sql.replace(/\?\?|\?/g, (m) => {
		const v = values[i++];
		if (m === '??') return ident(v);
		rest.push(v);
		return '?';
	});
	return [text, rest];
}

function wrap(conn: Connection) {
	const manager = db().connectionManager as unknown as { releaseConnection(c: Connection): void };
	return {
		query(sql: string, values: unknown[] | Callback, cb?: Callback) {
			const done = (typeof values === 'function' ? values : cb) as Callback;
			const list = Array.isArray(values) ? values : [];
			const [text, params] = identifiersInline(sql, list);
			// BIGINT expiry times as numbers: the library does arithmetic with Date.now().
			conn.query({ sql: text, bigIntAsNumber: true }, params).then(
				(rows) => done(null, rows),
				(err) => done(err)
			);
		},
		rollback() {
			conn.query('ROLLBACK').catch(() => undefined);
		},
		release() {
			manager.releaseConnection(conn);
		}
	};
}

/** The `pool` client the MySQL store asks for (storeType 'pool'). */
export const limitStore = {
	getConnection(cb: (err: unknown, conn?: ReturnType<typeof wrap>) => void) {
		const manager = db().connectionManager as unknown as {
			getConnection(o: { type: string; useMaster: boolean }): Promise<Connection>;
		};
		manager.getConnection({ type: 'SELECT', useMaster: true }).then(
			(conn) => cb(null, wrap(conn)),
			(err) => cb(err)
		);
	}
};
