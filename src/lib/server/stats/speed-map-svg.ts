import { parseHTML } from 'linkedom';
import { drawSpeedMap } from '../../stats/speed-map-plot';
import type { Units } from '../../sheet/units';
import type { SpeedMap } from './speed-map';

/**
 * The speed map as markup, drawn on the server into linkedom's document by the same function the
 * browser uses after a change: the first chart needs no script, and shows with none.
 */
export function speedMapMarkup(map: SpeedMap, units: Units): string {
	const { document } = parseHTML('<!doctype html><html><head></head><body></body></html>');
	return drawSpeedMap(map, units, document as unknown as Document).outerHTML;
}
