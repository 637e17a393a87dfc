import { SIDE_BY_SIDE_MAX } from './pick';

// The builds a reader has picked for side by side, kept in this browser (local storage) so the
// pick survives paging, searching and moving between build pages. Tabs share it.

const KEY = 'squishline.side-by-side';

export type Picked = { id: number; title: string };

class Tray {
	items = $state<Picked[]>([]);
	/** Said once after a refused pick (the limit), for a live region. */
	notice = $state('');
	#loaded = false;

	load() {
		if (this.#loaded || typeof localStorage === 'undefined') return;
		this.#loaded = true;
		try {
			const v = JSON.parse(localStorage.getItem(KEY) ?? '[]');
			if (Array.isArray(v))
				this.items = v
					.filter((x) => Number.isInteger(x?.id) && typeof x?.title === 'string')
					.slice(0, SIDE_BY_SIDE_MAX);
		} catch {
			this.items = [];
		}
		addEventListener('storage', (e) => {
			if (e.key === KEY) {
				this.#loaded = false;
				this.load();
			}
		});
	}

	has(id: number) {
		return this.items.some((x) => x.id === id);
	}

	/** Adds or removes; refuses a fifth with a notice instead of dropping one silently. */
	toggle(p: Picked) {
		this.notice = '';
		if (this.has(p.id)) this.items = this.items.filter((x) => x.id !== p.id);
		else if (this.items.length >= SIDE_BY_SIDE_MAX) {
			this.notice = `Side by side holds ${SIDE_BY_SIDE_MAX} builds: remove one before adding “${p.title}”.`;
			return;
		} else this.items = [...this.items, p];
		this.#save();
	}

	clear() {
		this.items = [];
		this.notice = '';
		this.#save();
	}

	get href() {
		return `/side-by-side?builds=${this.items.map((x) => x.id).join(',')}`;
	}

	#save() {
		try {
			localStorage.setItem(KEY, JSON.stringify(this.items));
		} catch {
			// Private mode or full storage: the pick still works on this page.
		}
	}
}

export const tray = new Tray();
