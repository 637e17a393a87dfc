// Turning what a reader typed into a MariaDB FULLTEXT boolean query. InnoDB indexes words of three
// characters or more and skips a short list of stopwords; asking for either would match nothing.
const STOPWORDS = new Set(
	'about are com des die een for from how that the this und was what when where who will with www'.split(
		' '
	)
);

export function words(text: string): string[] {
	return (text.toLowerCase().match(/[\p{L}\p{N}]+/gu) ?? []).filter(
		(w) => w.length >= 3 && !STOPWORDS.has(w)
	);
}

/** Every word required, each also as a prefix ("cham" finds "chamber"). Null when nothing is left. */
export function booleanQuery(text: string): string | null {
	const ws = words(text);
	return ws.length ? ws.map((w) => `+${w}*`).join(' ') : null;
}

/** The longest word kept in the search index; longer ones are cut (and typed ones the same way). */
export const WORD_MAX = 40;

/** The distinct words a build is found by: those of its title, story and part names. */
export function buildWords(title: string, story: string, partsText: string): string[] {
	return [...new Set(words(`${title} ${story} ${partsText}`).map((w) => w.slice(0, WORD_MAX)))];
}
