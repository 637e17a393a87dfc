import { QueryTypes, type Model, type ModelStatic } from 'sequelize';
import { db } from './connection';

/**
 * A page that shows a build with its setups, runs, parts, photos, links and comments used to ask
 * for each list on its own: a dozen round trips holding most of the pool. Here each list becomes
 * one column of a single SELECT (a correlated subquery folding its rows into a JSON array), and the
 * rows come back as model instances, so the code that reads them does not change.
 */
export interface Column<T> {
	/** A scalar SQL expression; it may use the statement's named replacements. */
	sql: string;
	read: (value: unknown) => T;
}

type Values<C> = { [K in keyof C]: C[K] extends Column<infer T> ? T : never };

// JSON_ARRAYAGG is bounded by group_concat_max_len (1 MB by default); a long comment thread can
// pass it, and a cut array would fail to parse. Raised for this one statement only.
const ROOM = 64 * 1024 * 1024;

/** Runs one SELECT of the given columns and reads each. */
export async function selectColumns<C extends Record<string, Column<unknown>>>(
	columns: C,
	replacements: Record<string, unknown>
): Promise<Values<C>> {
	const names = Object.keys(columns);
	const list = names.map((n) => `${columns[n].sql} AS \`${n}\``).join(',\n');
	const [row] = await db().query<Record<string, unknown>>(
		`SET STATEMENT group_concat_max_len = ${ROOM} FOR SELECT ${list}`,
		{ replacements, type: QueryTypes.SELECT }
	);
	return Object.fromEntries(names.map((n) => [n, columns[n].read(row[n])])) as Values<C>;
}

/** A scalar column as it comes from the driver. */
export const scalar = <T>(sql: string, read: (v: unknown) => T = (v) => v as T): Column<T> => ({
	sql,
	read
});

type Rows<M extends Model> = { rows: M[]; extras: unknown[][] };

/**
 * A model's rows as one column: every attribute, in the model's order, then `extra` expressions
 * (joined names and the like), which come back beside each instance.
 */
export function nestedRows<M extends Model>(
	model: ModelStatic<M>,
	opts: { alias: string; where: string; order: string; join?: string; extra?: string[] }
): Column<Rows<M>> {
	const attrs = Object.entries(model.getAttributes());
	const cols = attrs.map(([, a]) => `${opts.alias}.\`${a.field}\``).concat(opts.extra ?? []);
	const table = model.getTableName() as string;
	return {
		sql: `(SELECT JSON_ARRAYAGG(JSON_ARRAY(${cols.join(', ')}) ORDER BY ${opts.order})
			FROM \`${table}\` ${opts.alias} ${opts.join ?? ''} WHERE ${opts.where})`,
		read: (value) => {
			const list = parseJson(value) as unknown[][] | null;
			const rows: M[] = [];
			const extras: unknown[][] = [];
			for (const values of list ?? []) {
				const data: Record<string, unknown> = {};
				attrs.forEach(([name, a], i) => (data[name] = decode(a.type, values[i])));
				rows.push(model.build(data as never, { isNewRecord: false, raw: true }));
				extras.push(values.slice(attrs.length));
			}
			return { rows, extras };
		}
	};
}

/** As `nestedRows`, for a list with no extra expressions: the instances alone. */
export function nestedList<M extends Model>(
	model: ModelStatic<M>,
	opts: { alias: string; where: string; order: string }
): Column<M[]> {
	const c = nestedRows(model, opts);
	return { sql: c.sql, read: (v) => c.read(v).rows };
}

/** A JSON value from the driver: MariaDB hands JSON back as text, or parsed when typed as JSON. */
export function parseJson(value: unknown): unknown {
	return typeof value === 'string' ? JSON.parse(value) : (value ?? null);
}

// What JSON_ARRAY makes of each column type, turned back into what Sequelize would have given.
function decode(type: unknown, v: unknown): unknown {
	if (v === null || v === undefined) return null;
	const key = (type as { key?: string }).key;
	if (key === 'BOOLEAN') return Boolean(v);
	// DATETIME values are stored in UTC (Sequelize's default time zone for MariaDB).
	if (key === 'DATE') return new Date(`${String(v).replace(' ', 'T')}Z`);
	if (key === 'JSON') return parseJson(v);
	return v;
}
