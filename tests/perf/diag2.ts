import { buildListSchema } from '../../src/lib/schemas/build-list';
import { listBuilds } from '../../src/lib/server/db/build-list';
import { speedMap } from '../../src/lib/server/stats/speed-map';
import { speedMapQuerySchema, SPEED_MAP_X } from '../../src/lib/stats/schema';
import { FAMILIES } from './seed';
import { closeDb, db } from '../../src/lib/server/db/connection';
import { mulberry32, MAKERS } from './seed';
const rnd = mulberry32(11);
const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
const PIPES = ['stock', 'sport', 'expansion-chamber'];
const log: string[] = [];
const orig = db().query.bind(db());
// eslint-disable-next-line @typescript-eslint/no-explicit-any
(db() as any).query = async (sql: string, o: any) => {
	const t0 = performance.now();
	const r = await orig(sql, o);
	log.push(`${(performance.now() - t0).toFixed(1)}ms`);
	return r;
};
const res: [number, string][] = [];
const mode = process.argv[2];
for (let i = 0; i < 60; i++) {
	const lo = pick([45, 60, 65, 70, 75]);
	const raw =
		mode === 'search'
			? {
					q:
						rnd() < 0.5
							? pick(MAKERS).toLowerCase()
							: pick(['chamber', 'silencer', 'variator', 'roller', 'harbour', 'seized', 'squish'])
				}
			: {
					exhaust: pick(PIPES),
					ccMin: lo,
					ccMax: lo + pick([5, 10, 20]),
					speedMin: pick([0, 40, 60, 80, 100]),
					sort: pick(['newest', 'fastest'])
				};
	log.length = 0;
	const t0 = performance.now();
	let r = { builds: [] as unknown[] };
	if (mode === 'map') {
		const mq = {
			x: pick(Object.keys(SPEED_MAP_X)),
			method: rnd() < 0.5 ? pick(['gps-logger', 'radar']) : undefined,
			pipe: rnd() < 0.5 ? pick(PIPES) : undefined,
			twoWay: rnd() < 0.3 ? '1' : undefined,
			family: rnd() < 0.2 ? pick(FAMILIES) : undefined
		};
		Object.assign(raw, mq);
		const m = await speedMap(speedMapQuerySchema.parse(mq));
		r = { builds: Array(m.total) };
	} else r = await listBuilds(buildListSchema.parse(raw), 'metric');
	const ms = performance.now() - t0;
	res.push([
		ms,
		`${ms.toFixed(1)} ${JSON.stringify(raw)} n=${r.builds.length} | ${log.join(', ')}`
	]);
}
res.sort((a, b) => b[0] - a[0]);
for (const [, s] of res.slice(0, 10)) console.log(s);
await closeDb();
