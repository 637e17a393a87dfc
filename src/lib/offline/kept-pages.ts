// Which pages the app keeps a copy of for reading without a signal: a member's bench, build pages
// and the forms that log runs and setups. Shared by the service worker and the page (which empties
// the copy when the account changes, so a shared phone never shows the last member's bench).

export const KEPT_PAGES_CACHE = 'kept-pages-v1';
export const KEPT_PAGE_LIMIT = 40;

const KEPT = [
	/^\/$/,
	/^\/bench$/,
	/^\/builds\/\d+$/,
	/^\/builds\/\d+\/edit$/,
	/^\/builds\/\d+\/setups\/new$/,
	/^\/builds\/\d+\/setups\/\d+\/(edit|runs\/new)$/,
	/^\/builds\/\d+\/runs\/\d+\/edit$/
];

/** A page's path, or its data's (`…/__data.json`, fetched when moving between pages). */
export function keepsPage(pathname: string): boolean {
	const page = pathname.replace(/\/__data\.json$/, '') || '/';
	return KEPT.some((re) => re.test(page));
}

const OWNER_KEY = 'sl-kept-pages-owner';

/** Empties the kept pages when the account on this browser changes (or signs out). */
export async function forgetKeptPagesOfOthers(owner: string | null): Promise<void> {
	if (typeof caches === 'undefined' || typeof localStorage === 'undefined') return;
	try {
		if (localStorage.getItem(OWNER_KEY) === (owner ?? '')) return;
		await caches.delete(KEPT_PAGES_CACHE);
		localStorage.setItem(OWNER_KEY, owner ?? '');
	} catch {
		// storage off: nothing was kept either
	}
}
