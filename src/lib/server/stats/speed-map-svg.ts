import { createHash } from 'node:crypto';
import { parseHTML } from 'linkedom';
import { drawSpeedMap } from '../../stats/speed-map-plot';
import type { Units } from '../../sheet/units';
import { recent } from '../../recent';
import type { SpeedMap } from './speed-map';

// Drawing takes tens of milliseconds for a thousand marks, and most readers open the same few
// maps: drawings are kept by what they show (a hash of the map's data and the units), so a
// changed map is drawn anew and an unchanged one never is.
const drawn = recent<string>(64);
// The kept map (stats/kept.ts) is the same object while nothing changes: its drawing is found
// without hashing hundreds of kilobytes of JSON on every request.
const byMap = new WeakMap<SpeedMap, Partial<Record<Units, string>>>();

/**
 * The speed map as markup, drawn on the server into linkedom's document by the same function the
 * browser uses after a change: the first chart needs no script, and shows with none.
 */
export function speedMapMarkup(map: SpeedMap, units: Units): string {
	const mine = byMap.get(map) ?? {};
	byMap.set(map, mine);
	return (mine[units] ??= draw(map, units));
}

function draw(map: SpeedMap, units: Units): string {
	const key = createHash('sha1').update(units).update(JSON.stringify(map)).digest('base64url');
	return drawn(key, () => {
		const { document } = parseHTML('<!doctype html><html><head></head><body></body></html>');
		return drawSpeedMap(map, units, document as unknown as Document).outerHTML;
	});
}
