// The build-sheet exchange format, version 1. Values are in canonical units (mm, cc, km/h, m,
// °C, kg, kPa); empty optional values are left out. Its JSON Schema is generated from this.
import { z } from 'zod';
import { BUILD_FIELDS, PART_CATEGORIES } from './fields';
import { RUN_FIELDS } from './run-fields';
import { schemaFor } from './schema';
import { SETUP_FIELDS } from './setup-fields';

export const FORMAT = 'squishline.build-sheet';
export const FORMAT_VERSION = 1;

const build = schemaFor('x-build', BUILD_FIELDS, 'metric', 'draft').omit({ units: true });
const config = schemaFor('x-setup', SETUP_FIELDS, 'metric', 'draft').omit({
	units: true,
	changeNote: true,
	isStock: true
});
const run = schemaFor('x-run', RUN_FIELDS, 'metric', 'complete').omit({ units: true });

export const exportSchema = z.object({
	format: z.literal(FORMAT),
	version: z.literal(FORMAT_VERSION),
	exportedAt: z.string().optional(),
	source: z.string().optional(),
	build,
	setups: z
		.array(
			z.object({
				changeNote: z.string().trim().min(2).max(200),
				isStock: z.boolean().default(false),
				config,
				runs: z.array(run).max(100).default([])
			})
		)
		.max(50),
	parts: z
		.array(
			z.object({
				category: z.enum(PART_CATEGORIES.map((o) => o.value) as [string, ...string[]]),
				name: z.string().trim().min(2).max(160),
				costMinor: z.number().int().min(0).max(10_000_000),
				link: z
					.url({ protocol: /^https?$/ })
					.max(500)
					.nullable()
					.default(null),
				/** Index into `setups` of the setup the part first appeared in. */
				setup: z.number().int().min(0).nullable().default(null)
			})
		)
		.max(200)
		.default([])
});

export type BuildSheetExport = z.infer<typeof exportSchema>;

export function exportJsonSchema() {
	return {
		...z.toJSONSchema(exportSchema, { io: 'input', unrepresentable: 'any' }),
		$id: '/api/schema/build-sheet.json',
		title: 'Squishline build sheet, format version 1',
		description:
			'A build with its setup history, runs and parts. Lengths mm, volumes cc, speeds km/h, elevations m, temperatures °C, masses kg, pressures kPa, money in integer minor units of build.currency.'
	};
}
