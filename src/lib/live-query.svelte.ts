import { replaceState } from '$app/navigation';
import { page } from '$app/state';

/**
 * Asks a JSON route as a form changes: waits for typing to settle, keeps only the newest answer,
 * says when it is busy or failed, and puts the query in the address bar so the view can be shared.
 * Call `ask` from an $effect and return what it returns (it cancels a pending ask).
 */
export class LiveQuery<T> {
	busy = $state(false);
	problem = $state('');
	#seq = 0;
	#first = true;

	constructor(
		private endpoint: string,
		private failure: string,
		private onAnswer: (body: T) => void,
		private delayMs = 250
	) {}

	ask(q: URLSearchParams) {
		// The first answer came with the page.
		if (this.#first) {
			this.#first = false;
			return;
		}
		const mine = ++this.#seq;
		this.busy = true;
		const timer = setTimeout(async () => {
			try {
				const res = await fetch(`${this.endpoint}?${q}`);
				const body = await res.json();
				if (mine !== this.#seq) return;
				if (!res.ok) throw new Error(body.error ?? res.statusText);
				this.onAnswer(body as T);
				this.problem = '';
				replaceState(`${page.url.pathname}?${q}`, {});
			} catch (e) {
				if (mine === this.#seq) this.problem = `${this.failure}: ${(e as Error).message}`;
			} finally {
				if (mine === this.#seq) this.busy = false;
			}
		}, this.delayMs);
		return () => clearTimeout(timer);
	}
}
