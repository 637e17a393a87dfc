// A draft for a form on the current page, kept for the signed-in account.
import { page } from '$app/state';
import type { Field } from '../sheet/fields';
import { convertTyped } from '../sheet/convert-typed';
import type { Units } from '../sheet/units';
import { FormDraft, type DraftOptions } from './form-draft.svelte';

export const draftHere = (name: string, more: Partial<DraftOptions> = {}) =>
	new FormDraft({ owner: page.data.user?.id, place: `${page.url.pathname}:${name}`, ...more });

/** A sheet form's draft: kept in the units it was typed in, and converted when the reader
 * switches units (the switch reloads the page). */
export const sheetDraft = (name: string, fields: Field[], units: Units) =>
	draftHere(name, {
		units,
		convert: (values, from, to) => convertTyped(fields, values, from as Units, to as Units)
	});
