// One form's unsent draft: restored when the form appears, kept as it is typed, dropped once the
// server has it. `unsentChanges()` tells the layout whether leaving should ask first.
import { fieldValues, putValues, sameValues } from './fields';
import { draftKey, dropDraft, readDraft, writeDraft, type FieldValue } from './store';

export type DraftOptions = {
	/** The signed-in account; without one nothing is kept. */
	owner: string | number | null | undefined;
	/** Which form: the page's path and a name for the form on it. */
	place: string;
	/** The units the form is typed in, and how to carry typed values into others. */
	units?: string;
	convert?: (values: FieldValue[], from: string, to: string) => FieldValue[];
};

// Read only when a navigation starts, never rendered: a plain Set is enough.
// eslint-disable-next-line svelte/prefer-svelte-reactivity
const live = new Set<FormDraft>();

/** True while some form on the page holds changes that are not on their way to the server. */
export const unsentChanges = () => [...live].some((d) => d.dirty && !d.sending);

export class FormDraft {
	/** When the draft put back on this form was typed, or null when none was. */
	restoredAt = $state<number | null>(null);
	dirty = $state(false);
	sending = false;
	#key: string | null;
	#units: string | undefined;
	#convert: DraftOptions['convert'];
	#form: HTMLFormElement | null = null;
	#initial: FieldValue[] = [];

	constructor(o: DraftOptions) {
		this.#key = o.owner ? draftKey(String(o.owner), o.place) : null;
		this.#units = o.units;
		this.#convert = o.convert;
	}

	/** The form's action (`use:draft.attach`). */
	attach = (form: HTMLFormElement) => {
		this.#form = form;
		this.#initial = fieldValues(form);
		live.add(this);
		this.#restore(form);
		const note = () => this.#note();
		const submit = () => (this.sending = true);
		form.addEventListener('input', note);
		form.addEventListener('change', note);
		form.addEventListener('submit', submit);
		return {
			destroy: () => {
				form.removeEventListener('input', note);
				form.removeEventListener('change', note);
				form.removeEventListener('submit', submit);
				live.delete(this);
			}
		};
	};

	#restore(form: HTMLFormElement) {
		const saved = this.#key ? readDraft(this.#key) : null;
		if (!saved || !this.#key) return;
		let values = saved.values;
		if (saved.units && this.#units && saved.units !== this.#units && this.#convert)
			values = this.#convert(values, saved.units, this.#units);
		if (sameValues(values, this.#initial)) return dropDraft(this.#key);
		putValues(form, values);
		this.restoredAt = saved.savedAt;
		this.dirty = true;
		writeDraft(this.#key, { savedAt: saved.savedAt, units: this.#units, values });
	}

	#note() {
		if (!this.#form || !this.#key) return;
		const now = fieldValues(this.#form);
		this.dirty = !sameValues(now, this.#initial);
		if (this.dirty) writeDraft(this.#key, { savedAt: Date.now(), units: this.#units, values: now });
		else dropDraft(this.#key);
	}

	/** Back to what the server gave, the draft forgotten. */
	discard() {
		if (this.#form) putValues(this.#form, this.#initial);
		if (this.#key) dropDraft(this.#key);
		this.restoredAt = null;
		this.dirty = false;
	}

	/** The server has it: nothing left to keep. */
	sent() {
		if (this.#key) dropDraft(this.#key);
		this.restoredAt = null;
		this.dirty = false;
		this.sending = false;
		// The page may empty the form once it is sent: what it shows then is the new starting point.
		setTimeout(() => {
			if (this.#form) this.#initial = fieldValues(this.#form);
		});
	}

	/** It did not get there: the draft stays, and leaving asks again. */
	failed() {
		this.sending = false;
	}
}
