import { versionSchema } from '../../schemas/sheet';
import { PART_FIELDS, type Field } from '../../sheet/fields';
import { schemaFor, toStored, type Mode } from '../../sheet/schema';
import { parse } from '../../failure';

/**
 * A JSON body for a sheet entity, checked with the same generated schema as its form, in the
 * units it names (metric unless `units: "imperial"`), and converted to canonical units.
 */
export function sheetBody(name: string, fields: Field[], body: unknown, mode: Mode) {
	const units =
		body && typeof body === 'object' && (body as { units?: unknown }).units === 'imperial'
			? 'imperial'
			: 'metric';
	const data = parse(schemaFor(name, fields, units, mode), body) as Record<string, never>;
	return toStored(fields, data, units);
}

export const versionOf = (body: unknown) => parse(versionSchema, body).version;

/** A part as JSON: like its form, with the setup it was fitted in as a number or null. */
export function partBody(body: unknown) {
	const b = (body ?? {}) as Record<string, unknown>;
	const setupId = b.setupId === undefined || b.setupId === null ? '' : String(b.setupId);
	return sheetBody('part', PART_FIELDS, { ...b, setupId }, 'complete');
}
