import type { SpeedMap } from '../server/stats/speed-map';
import { toShown, UNIT, type Units } from '../sheet/units';
import { pipeLabel } from './pipes';
import { SPEED_MAP_X } from './speed-map-axes';

// The speed map's table ("the same data as a table") as markup: up to a few thousand rows that
// never change on their own. Kept out of the page's components so the browser does not walk and
// wire every row when the page wakes (on a phone that was most of the page's blocking time): the
// browser makes the same string and takes over the server's rows as they are.

const esc = (s: string) =>
	s.replace(
		/[&<>"']/g,
		(c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!
	);

/** A value across, in the reader's units, with its unit. */
export function formatX(map: Pick<SpeedMap, 'x'>, units: Units, v: number | string): string {
	if (typeof v === 'string') return pipeLabel(v);
	const spec = SPEED_MAP_X[map.x];
	const elevation = map.x === 'elevation';
	const unit = elevation ? UNIT.elevation[units] : spec.unit;
	const shown = elevation ? toShown(v, 'elevation', units) : v;
	const digits = elevation || map.x === 'displacement' ? 0 : 2;
	return `${shown.toFixed(digits)}${unit && unit !== ':1' ? ` ${unit}` : unit}`;
}

export const formatKmh = (units: Units, v: number) =>
	`${toShown(v, 'speed', units).toFixed(1)} ${UNIT.speed[units]}`;

/** The table's rows (its body), escaped: titles are members' own words. */
export function speedMapRows(map: SpeedMap, units: Units): string {
	const cell = (s: string, num = false) => `<td${num ? ' class="num"' : ''}>${esc(s)}</td>`;
	const row = (cells: string) => `<tr class="border-t border-paper-edge">${cells}</tr>`;
	if (map.mode === 'points')
		return map.points
			.map((p) =>
				row(
					`<td><a href="/builds/${p.buildId}">${esc(p.title)}</a></td>` +
						cell(formatX(map, units, p.x), true) +
						cell(pipeLabel(p.pipe)) +
						cell(formatKmh(units, p.kmh), true)
				)
			)
			.join('');
	return map.bins
		.map((b) =>
			row(
				cell(formatX(map, units, b.x), true) +
					cell(pipeLabel(b.pipe)) +
					cell(formatKmh(units, b.y), true) +
					cell(String(b.n), true)
			)
		)
		.join('');
}
