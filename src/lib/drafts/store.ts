// Unsent drafts, kept in this browser's local storage per account, so a reload, a closed tab or a
// lost signal at the track loses nothing typed. Nothing here ever leaves the browser.

export type FieldValue = { name: string; value: string | boolean };
export type Draft = { savedAt: number; units?: string; values: FieldValue[] };

const PREFIX = 'sl-draft:v1:';

function storage(): Storage | null {
	try {
		return typeof localStorage === 'undefined' ? null : localStorage;
	} catch {
		return null; // storage switched off: drafts are simply not kept
	}
}

export const draftKey = (owner: string, place: string) => `${PREFIX}${owner}:${place}`;

export function readDraft(key: string): Draft | null {
	const raw = storage()?.getItem(key);
	if (!raw) return null;
	try {
		const d = JSON.parse(raw) as Draft;
		return Array.isArray(d?.values) && typeof d.savedAt === 'number' ? d : null;
	} catch {
		return null;
	}
}

export function writeDraft(key: string, draft: Draft): void {
	try {
		storage()?.setItem(key, JSON.stringify(draft));
	} catch {
		// full or refused: the form still works, the draft is just not kept
	}
}

export function dropDraft(key: string): void {
	storage()?.removeItem(key);
}

/** Drops every key under `prefix` that is not the given account's (`prefix + owner`, then `:` or
 * nothing): called on each page, so signing out (or in as someone else) leaves no one's unsent
 * words behind on a shared phone. */
export function dropStoredNotOf(prefix: string, owner: string | null): void {
	const s = storage();
	if (!s) return;
	const mine = (k: string) =>
		owner !== null && (k === prefix + owner || k.startsWith(`${prefix}${owner}:`));
	for (let i = s.length - 1; i >= 0; i--) {
		const k = s.key(i);
		if (k?.startsWith(prefix) && !mine(k)) s.removeItem(k);
	}
}

export const dropDraftsNotOf = (owner: string | null) => dropStoredNotOf(PREFIX, owner);
