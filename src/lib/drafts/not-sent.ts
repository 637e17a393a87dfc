// What a form says when a save got no answer or a fault: nothing was saved, what was typed stays.
import type { SubmitFunction } from '@sveltejs/kit';
import type { FormDraft } from './form-draft.svelte';

export function notSentWords(status: number | undefined): string {
	const offline = typeof navigator !== 'undefined' && !navigator.onLine;
	return offline || !status
		? 'Not sent — your entries are kept. Check the connection and press the button again.'
		: `Not saved (the server answered ${status}) — your entries are kept. Press the button again in a moment.`;
}

/** `use:enhance={keptSubmit(…)}` for a plain form: a lost signal or a server fault shows the words
 * instead of an error page, the button comes back and the draft stays; anything else goes on as
 * usual. */
export function keptSubmit(
	show: (words: string | null) => void,
	draft?: FormDraft
): SubmitFunction {
	return () => {
		show(null);
		return async ({ result, update }) => {
			if (result.type === 'error') {
				show(notSentWords((result as { status?: number }).status));
				draft?.failed();
				return;
			}
			if (result.type === 'redirect' || result.type === 'success') draft?.sent();
			else draft?.failed();
			await update();
		};
	};
}

/** The same for a superform: its options for the draft and the words. */
export function keptSuperForm(draft: FormDraft, show: (words: string | null) => void) {
	return {
		onSubmit: () => show(null),
		onResult: ({ result }: { result: { type: string } }) => {
			if (result.type === 'redirect' || result.type === 'success') draft.sent();
			else draft.failed();
		},
		onError: ({ result }: { result: { status?: number } }) => {
			// No answer at all (the signal dropped at the track) or a server fault: nothing was saved.
			draft.failed();
			show(notSentWords(Number(result.status ?? 0)));
		}
	};
}
