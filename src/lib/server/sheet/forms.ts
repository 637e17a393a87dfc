import { superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import type { Field } from '../../sheet/fields';
import { schemaFor, toForm, toStored, type Mode } from '../../sheet/schema';
import type { Units } from '../../sheet/units';

/** Parses a posted sheet form in the units it was typed in; `version` rides outside the schema. */
export async function readSheetForm(
	request: Request,
	name: string,
	fields: Field[],
	mode: Mode = 'draft'
) {
	const fd = await request.formData();
	const units: Units = fd.get('units') === 'imperial' ? 'imperial' : 'metric';
	const form = await superValidate(fd, zod4(schemaFor(name, fields, units, mode)));
	const version = Number(fd.get('version') ?? 0);
	const stored = form.valid ? toStored(fields, form.data as Record<string, never>, units) : {};
	return { form, units, version: Number.isInteger(version) ? version : 0, stored, fd };
}

/** An empty or prefilled form for the page, in the reader's units. */
export async function sheetForm(
	name: string,
	fields: Field[],
	units: Units,
	stored: Record<string, unknown> | null,
	mode: Mode = 'draft'
) {
	const schema = zod4(schemaFor(name, fields, units, mode));
	return stored
		? superValidate(toForm(fields, stored, units) as never, schema, { errors: false })
		: superValidate(schema);
}
