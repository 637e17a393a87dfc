// Saves made without a signal wait here, in this browser's local storage per account, and go to
// the server in the order they were made once it answers. Each is the form's own POST, sent the
// way the page's form would send it (creates carry an Idempotency-Key, so a resend after a lost
// answer makes nothing new). A change that meets a newer version on the server stops the line
// and is shown beside the server's copy; nothing is overwritten until the member chooses.
import { deserialize } from '$app/forms';
import { invalidateAll } from '$app/navigation';
import { draftKey, dropStoredNotOf, writeDraft } from '../drafts/store';
import { dropFile, keptFileIds, readFile } from './files';

export type ServerCopy = { values: Record<string, unknown>; version: number };

export type Waiting = {
	/** Also the Idempotency-Key (and, for a photo, the key of its file in IndexedDB). */
	id: string;
	/** A form's POST (the default), or a photo sent to the JSON API with its file. */
	kind?: 'form' | 'photo';
	/** How much of a photo has gone, in per cent, while it is sending. */
	progress?: number | null;
	/** The form action it is sent to. */
	url: string;
	/** The form's page and name, to open it there again as a draft. */
	page: string;
	form: string;
	units?: string;
	/** What it is, in words, and the words for each field. */
	label: string;
	labels: Record<string, string>;
	fields: [string, string][];
	queuedAt: number;
	state: 'waiting' | 'sending' | 'accepted' | 'refused' | 'conflict';
	problem?: string;
	theirs?: ServerCopy;
};

const PREFIX = 'sl-queue:v1:';
const keyOf = (owner: string) => `${PREFIX}${owner}`;

/** One changed field of a conflict: what is in the queue and what the server holds. */
export type Difference = { name: string; label: string; mine: string; theirs: string };

const asTyped = (v: unknown) =>
	v === true ? 'on' : v === false || v === null || v === undefined ? '' : String(v);

export function differences(item: Waiting): Difference[] {
	if (!item.theirs) return [];
	const mine: Record<string, string> = Object.fromEntries(item.fields);
	return Object.keys(item.labels)
		.map((name) => ({
			name,
			label: item.labels[name],
			mine: mine[name] ?? '',
			theirs: asTyped(item.theirs!.values[name])
		}))
		.filter((d) => d.mine !== d.theirs);
}

/** The words a refused save came back with (the form's message or its fields' problems). */
function refusal(data: unknown): string {
	const form = (data as { form?: { message?: unknown; errors?: Record<string, unknown> } })?.form;
	if (typeof form?.message === 'string') return form.message;
	const problems = Object.entries(form?.errors ?? {})
		.filter(([, v]) => Array.isArray(v) && v.length)
		.map(([k, v]) => `${k}: ${(v as string[]).join(' ')}`);
	return problems.length ? problems.join('; ') : 'The server refused it.';
}

class SendQueue {
	items = $state<Waiting[]>([]);
	#owner: string | null = null;
	#busy = false;

	/** The account whose queue this page shows; another account's is never read or sent. */
	useOwner(owner: string | null) {
		if (owner === this.#owner) return;
		this.#owner = owner;
		this.items = owner ? read(keyOf(owner)) : [];
		// Files that no waiting photo of this account names (another account's, or sent) go.
		const mine = new Set(this.items.map((i) => i.id));
		void keptFileIds().then((ids) => ids.filter((id) => !mine.has(id)).forEach(dropFile));
	}

	get waiting() {
		return this.items.filter((i) => i.state !== 'accepted').length;
	}

	add(item: Omit<Waiting, 'id' | 'queuedAt' | 'state'> & { id?: string }) {
		if (!this.#owner) return;
		const id = item.id ?? crypto.randomUUID();
		this.items.push({ ...item, id, queuedAt: Date.now(), state: 'waiting' });
		this.#save();
		void this.flush();
	}

	/** Sends what waits, oldest first; stops at the first that cannot go (no signal, a conflict,
	 * a refusal), so a later change never overtakes an earlier one. */
	async flush() {
		if (this.#busy || !this.#owner || (typeof navigator !== 'undefined' && !navigator.onLine))
			return;
		this.#busy = true;
		let arrived = 0;
		try {
			for (const item of this.items) {
				if (item.state === 'accepted') continue;
				if (item.state !== 'waiting') break;
				item.state = 'sending';
				if ((await send(item)) !== 'accepted') break;
				arrived++;
				this.#save();
			}
		} finally {
			this.#busy = false;
			this.#save();
		}
		// The page on screen shows what the server has now.
		if (arrived) await invalidateAll();
	}

	/** After a conflict: send with the values chosen field by field, over the server's version. */
	resolve(id: string, takeTheirs: Set<string>) {
		const item = this.items.find((i) => i.id === id);
		if (!item?.theirs) return;
		const theirs = item.theirs;
		const fields = item.fields.filter(([k]) => !takeTheirs.has(k) && k !== 'version');
		for (const name of takeTheirs) {
			const v = asTyped(theirs.values[name]);
			if (v !== '') fields.push([name, v]);
		}
		fields.push(['version', String(theirs.version)]);
		Object.assign(item, { fields, state: 'waiting', theirs: undefined, problem: undefined });
		this.#save();
		void this.flush();
	}

	/** Puts a change back into its form as a draft (to fix a refusal, or merge by hand). */
	toForm(id: string): string | null {
		const item = this.items.find((i) => i.id === id);
		if (!item || !this.#owner) return null;
		const values = item.fields
			.filter(([k]) => k in item.labels)
			.map(([name, value]) => ({ name, value }));
		writeDraft(draftKey(this.#owner, `${item.page}:${item.form}`), {
			savedAt: item.queuedAt,
			units: item.units,
			values
		});
		this.drop(id);
		return item.page;
	}

	drop(id: string) {
		this.items = this.items.filter((i) => i.id !== id);
		void dropFile(id);
		this.#save();
	}

	/** Forgets the ones the server has, once the member has seen them. */
	clearAccepted() {
		this.items = this.items.filter((i) => i.state !== 'accepted');
	}

	#save() {
		if (!this.#owner) return;
		const open = this.items.filter((i) => i.state !== 'accepted');
		try {
			if (open.length) localStorage.setItem(keyOf(this.#owner), JSON.stringify(open));
			else localStorage.removeItem(keyOf(this.#owner));
		} catch {
			// storage full or off: the queue lives on in this page until it is sent
		}
	}
}

function read(key: string): Waiting[] {
	try {
		const items = JSON.parse(localStorage.getItem(key) ?? '[]') as Waiting[];
		// One cut off mid-send is sent again: its key makes a second arrival harmless.
		return items.map((i) => (i.state === 'sending' ? { ...i, state: 'waiting' } : i));
	} catch {
		return [];
	}
}

async function send(item: Waiting): Promise<Waiting['state']> {
	if (item.kind === 'photo') return sendPhoto(item);
	const body = new FormData();
	for (const [k, v] of item.fields) body.append(k, v);
	let text: string;
	try {
		const answer = await fetch(item.url, {
			method: 'POST',
			body,
			headers: {
				accept: 'application/json',
				'x-sveltekit-action': 'true',
				'idempotency-key': item.id
			}
		});
		text = await answer.text();
	} catch {
		return (item.state = 'waiting'); // no signal after all: it waits for the next try
	}
	let result;
	try {
		result = deserialize(text);
	} catch {
		return (item.state = 'waiting');
	}
	if (result.type === 'redirect' || result.type === 'success') item.state = 'accepted';
	else if (result.type === 'failure' && result.status === 409 && result.data?.current) {
		item.state = 'conflict';
		item.theirs = result.data.current as ServerCopy;
	} else if (result.type === 'failure') {
		item.state = 'refused';
		item.problem = refusal(result.data);
	} else item.state = 'waiting'; // a server fault: nothing was saved; tried again later
	return item.state;
}

/** A kept photo goes to the JSON API with its key, its progress shown as it goes. */
async function sendPhoto(item: Waiting): Promise<Waiting['state']> {
	const file = await readFile(item.id).catch(() => undefined);
	if (!file) {
		item.problem = 'The photo is no longer kept on this device: choose it again.';
		return (item.state = 'refused');
	}
	const body = new FormData();
	body.append('file', file, file instanceof File ? file.name : 'photo');
	for (const [k, v] of item.fields) body.append(k, v);
	item.progress = 0;
	const status = await new Promise<{ code: number; text: string }>((resolve) => {
		const xhr = new XMLHttpRequest();
		xhr.open('POST', item.url);
		xhr.setRequestHeader('idempotency-key', item.id);
		xhr.upload.onprogress = (ev) => {
			if (ev.lengthComputable) item.progress = Math.round((100 * ev.loaded) / ev.total);
		};
		xhr.onload = () => resolve({ code: xhr.status, text: xhr.responseText });
		xhr.onerror = () => resolve({ code: 0, text: '' });
		xhr.send(body);
	});
	item.progress = null;
	if (status.code === 201) {
		void dropFile(item.id);
		return (item.state = 'accepted');
	}
	if (status.code === 0 || status.code >= 500) return (item.state = 'waiting');
	try {
		item.problem = JSON.parse(status.text).error;
	} catch {
		item.problem = `The server refused it (${status.code}).`;
	}
	return (item.state = 'refused');
}

/** Drops every account's queue but this one's (signing out takes one's waiting changes along). */
export const dropQueuesNotOf = (owner: string | null) => dropStoredNotOf(PREFIX, owner);

export const sendQueue = new SendQueue();
