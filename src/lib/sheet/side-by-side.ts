// Side by side: every field of 2–4 setups in aligned rows, in the reader's units, with the rows that
// differ marked. Pure, so the page and its tests build the same rows.
import { fixed } from '../intl';
import { deriveSetup } from './derive';
import { BUILD_FIELDS, type Field } from './fields';
import { formatField } from './format';
import { SETUP_FIELDS } from './setup-fields';
import { show, type Units } from './units';

export type Column = {
	buildId: number;
	setupId: number;
	title: string;
	owner: string;
	position: number;
	changeNote: string;
	build: Record<string, unknown>;
	config: Record<string, unknown>;
	best: {
		kmh: number;
		method: string;
		twoWay: boolean;
		venue: string | null;
		elevationM: number | null;
		airDensity: number | null;
	} | null;
	partsTotal: string;
};
export type Row = { label: string; values: string[]; differs: boolean };
export type Section = { title: string; rows: Row[] };

export const BUILD_SHOWN = [
	'chassis',
	'engineFamily',
	'engineCycle',
	'cooling',
	'cylinderOrientation',
	'brakeFront',
	'brakeRear',
	'brakesUpgraded'
];
const num = (v: number | null, places: number, unit = '') =>
	v === null ? '—' : `${fixed(v, places)}${unit ? ` ${unit}` : ''}`;

function row(label: string, values: string[]): Row {
	return { label, values, differs: values.some((v) => v !== values[0]) };
}
const fieldRow = (f: Field, values: unknown[], units: Units) =>
	row(
		f.label,
		values.map((v) => formatField(f, v, units))
	);

export function sideBySide(cols: Column[], units: Units): Section[] {
	const sections: Section[] = [];
	sections.push({
		title: 'Build',
		rows: [
			row(
				'Setup',
				cols.map((c) => `${c.position}. ${c.changeNote}`)
			),
			...BUILD_FIELDS.filter((f) => BUILD_SHOWN.includes(f.name)).map((f) =>
				fieldRow(
					f,
					cols.map((c) => c.build[f.name]),
					units
				)
			),
			row(
				'Parts, total',
				cols.map((c) => c.partsTotal)
			)
		]
	});
	const bySection = new Map<string, Field[]>();
	for (const f of SETUP_FIELDS) {
		if (f.name === 'changeNote' || f.name === 'isStock') continue;
		bySection.set(f.section, [...(bySection.get(f.section) ?? []), f]);
	}
	for (const [title, fields] of bySection)
		sections.push({
			title,
			rows: fields.map((f) =>
				fieldRow(
					f,
					cols.map((c) => c.config[f.name]),
					units
				)
			)
		});
	const d = cols.map((c) => deriveSetup(c.config as never));
	sections.push({
		title: 'Worked out from the setup',
		rows: [
			row(
				'Displacement',
				d.map((x) => num(x.displacementCc, 1, 'cc'))
			),
			row(
				'Compression ratio',
				d.map((x) => num(x.compressionRatio, 1, ': 1'))
			),
			row(
				'Exhaust duration',
				d.map((x) => num(x.exhaustDuration, 0, '°'))
			),
			row(
				'Transfer duration',
				d.map((x) => num(x.transferDuration, 0, '°'))
			),
			row(
				'Final-drive ratio',
				d.map((x) => num(x.finalDriveRatio, 2, ': 1'))
			),
			row(
				'Overall ratio at top CVT',
				d.map((x) => num(x.overallRatio, 2, ': 1'))
			),
			row(
				'Roller weights, total',
				d.map((x) => num(x.rollerTotalG, 1, 'g'))
			),
			row(
				'Speed the gearing allows at peak rpm',
				d.map((x) => show(x.gearingLimitKmh, 'speed', units))
			)
		]
	});
	sections.push({
		title: 'Best run',
		rows: [
			row(
				'Top speed',
				cols.map((c) => show(c.best?.kmh, 'speed', units))
			),
			row(
				'Measured by',
				cols.map((c) => c.best?.method.replace('-', ' ') ?? '—')
			),
			row(
				'Two-way average',
				cols.map((c) => (c.best ? (c.best.twoWay ? 'yes' : 'no') : '—'))
			),
			row(
				'Where',
				cols.map((c) => c.best?.venue?.replace('-', ' ') ?? '—')
			),
			row(
				'Elevation',
				cols.map((c) => show(c.best?.elevationM, 'elevation', units))
			),
			row(
				'Air density',
				cols.map((c) => num(c.best?.airDensity ?? null, 3, 'kg/m³'))
			)
		]
	});
	return sections;
}
