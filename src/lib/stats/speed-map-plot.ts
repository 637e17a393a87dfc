import * as Plot from '@observablehq/plot';
import type { SpeedMap } from '../server/stats/speed-map';
import { SPEED_MAP_X } from './speed-map-axes';
import { PIPE_STYLE, pipeLabel } from './pipes';
import { toShown, UNIT, type Units } from '../sheet/units';

/** The width the server draws at; the SVG scales to its box (viewBox), so a phone sees it whole. */
export const CHART_WIDTH = 720;

/**
 * The speed map drawn with Observable Plot, into whichever document is given: the server's
 * (linkedom, so the chart is in the page before any script, or with none) or the browser's (when
 * the reader changes a setting). Colour and shape both say the pipe type, so the map still reads
 * in greyscale print or for colour-blind readers. Each mark names its build in a native tooltip
 * and, as a point, links to it: both work without script.
 */
export function drawSpeedMap(
	map: SpeedMap,
	units: Units,
	document: Document,
	width = CHART_WIDTH
): HTMLElement | SVGSVGElement {
	const xSpec = SPEED_MAP_X[map.x];
	const xShown = (v: number) => (map.x === 'elevation' ? toShown(v, 'elevation', units) : v);
	const yShown = (v: number) => toShown(v, 'speed', units);
	const xUnit = map.x === 'elevation' ? UNIT.elevation[units] : xSpec.unit;
	const speedUnit = UNIT.speed[units];
	const numeric = map.x !== 'exhaust';
	const pipes = Object.keys(PIPE_STYLE);
	const marks: Plot.Markish[] = [];
	if (map.mode === 'points') {
		const pts = map.points.map((p) => ({
			...p,
			sx: typeof p.x === 'number' ? xShown(p.x) : p.x,
			sy: yShown(p.kmh)
		}));
		marks.push(
			Plot.dot(pts, {
				x: 'sx',
				y: 'sy',
				stroke: 'pipe',
				symbol: 'pipe',
				r: 4,
				strokeWidth: 1.6,
				href: (d: (typeof pts)[number]) => `/builds/${d.buildId}`,
				title: (d: (typeof pts)[number]) => `${d.title}\n${d.sy.toFixed(1)} ${speedUnit}`
			})
		);
	} else {
		const bins = map.bins.map((b) => ({
			...b,
			cx: typeof b.x === 'number' ? xShown(b.x + ((b.x2 ?? b.x) - b.x) / 2) : b.x,
			cy: yShown(b.y + (b.y2 - b.y) / 2)
		}));
		marks.push(
			Plot.dot(bins, {
				x: 'cx',
				y: 'cy',
				r: 'n',
				stroke: 'pipe',
				symbol: 'pipe',
				fillOpacity: 0.15,
				fill: 'pipe',
				title: (d: (typeof bins)[number]) => `${d.n} builds, ${pipeLabel(d.pipe)}`
			})
		);
	}
	const t = map.trend;
	if (t && numeric)
		marks.push(
			Plot.line(
				[
					[xShown(t.from), yShown(t.intercept + t.slope * t.from)],
					[xShown(t.to), yShown(t.intercept + t.slope * t.to)]
				],
				{ stroke: 'currentColor', strokeDasharray: '6 4', strokeWidth: 1.5 }
			)
		);
	const chart = Plot.plot({
		document,
		width,
		height: 420,
		marginLeft: 56,
		style: {
			fontFamily: '"IBM Plex Mono", ui-monospace, monospace',
			fontSize: '12px',
			background: 'transparent'
		},
		x: {
			label: `${xSpec.label}${xUnit ? ` (${xUnit})` : ''}`,
			grid: true,
			// Inset: a mark at the smallest value sits clear of the axis, not on it.
			...(numeric
				? { inset: 14 }
				: { type: 'point' as const, domain: pipes, tickFormat: pipeLabel, inset: 14 })
		},
		y: { label: `Best measured speed (${speedUnit})`, grid: true, inset: 10 },
		color: { domain: pipes, range: pipes.map((p) => PIPE_STYLE[p].colour) },
		symbol: {
			domain: pipes,
			range: pipes.map((p) => PIPE_STYLE[p].symbol),
			legend: true,
			tickFormat: pipeLabel
		},
		marks
	});
	// The marks' links are for pointing at; the keyboard and screen readers get the same builds,
	// linked, in the table below, not hundreds of tab stops in a picture.
	for (const a of chart.querySelectorAll('a')) a.setAttribute('tabindex', '-1');
	return chart;
}
