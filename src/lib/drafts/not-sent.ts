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

/** The same for a superform: its options for the draft and the words. With `queue`, a save made
 * without a signal is handed to it (to wait on this device) instead of being refused. */
export function keptSuperForm(
	draft: FormDraft,
	show: (words: string | null) => void,
	queue?: (sent: FormData) => void
) {
	let last: FormData | null = null;
	const hand = (sent: FormData) => {
		draft.sent();
		queue!(sent);
	};
	return {
		onSubmit: ({ formData, cancel }: { formData: FormData; cancel: () => void }) => {
			show(null);
			last = formData;
			if (queue && typeof navigator !== 'undefined' && !navigator.onLine) {
				cancel();
				hand(formData);
			}
		},
		onResult: ({ result }: { result: { type: string } }) => {
			if (result.type === 'redirect' || result.type === 'success') draft.sent();
			else draft.failed();
		},
		onError: ({ result }: { result: { status?: number } }) => {
			// No answer at all (the signal dropped at the track) or a server fault: nothing was saved.
			draft.failed();
			const status = Number(result.status ?? 0);
			if (queue && !status && last) hand(last);
			else show(notSentWords(status));
		}
	};
}
