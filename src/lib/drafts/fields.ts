// Reading and writing a form's typed values, for drafts. Passwords, files and hidden fields are
// never read: a draft holds only what a person typed or chose.
import type { FieldValue } from './store';

type Control = HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement;

function controls(form: HTMLFormElement): Control[] {
	return [...form.elements].filter((el): el is Control => {
		if (!('name' in el) || !(el as Control).name) return false;
		if (el instanceof HTMLSelectElement || el instanceof HTMLTextAreaElement) return true;
		return (
			el instanceof HTMLInputElement &&
			!['hidden', 'password', 'file', 'submit', 'button', 'reset', 'image'].includes(el.type)
		);
	});
}

const isBox = (el: Control) =>
	el instanceof HTMLInputElement && (el.type === 'checkbox' || el.type === 'radio');

export function fieldValues(form: HTMLFormElement): FieldValue[] {
	return controls(form).map((el) => ({
		name: el.name,
		value: isBox(el) ? (el as HTMLInputElement).checked : el.value
	}));
}

export function sameValues(a: FieldValue[], b: FieldValue[]): boolean {
	return a.length === b.length && a.every((v, i) => v.name === b[i].name && v.value === b[i].value);
}

/** Puts values back by name (the n-th value of a name into the n-th field of that name) and tells
 * the page, as typing would, so bound state follows. */
export function putValues(form: HTMLFormElement, values: FieldValue[]): void {
	const seen = new Map<string, number>();
	const byName = new Map<string, FieldValue[]>();
	for (const v of values) byName.set(v.name, [...(byName.get(v.name) ?? []), v]);
	for (const el of controls(form)) {
		const n = seen.get(el.name) ?? 0;
		seen.set(el.name, n + 1);
		const v = byName.get(el.name)?.[n];
		if (!v) continue;
		if (isBox(el)) {
			// A draft says true; a posted form (a change put back from the send queue) says "on".
			const checked = v.value === true || v.value === 'on';
			if ((el as HTMLInputElement).checked === checked) continue;
			(el as HTMLInputElement).checked = checked;
		} else {
			if (el.value === v.value) continue;
			el.value = String(v.value);
		}
		el.dispatchEvent(new Event('input', { bubbles: true }));
		el.dispatchEvent(new Event('change', { bubbles: true }));
	}
}
