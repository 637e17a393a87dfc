// A draft for a form on the current page, kept for the signed-in account.
import { page } from '$app/state';
import { FormDraft, type DraftOptions } from './form-draft.svelte';

export const draftHere = (name: string, more: Partial<DraftOptions> = {}) =>
	new FormDraft({ owner: page.data.user?.id, place: `${page.url.pathname}:${name}`, ...more });
