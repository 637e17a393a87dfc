// The words a reader types and a build is found by (the search index, search_words): three
// characters or more, without a short list of stopwords, as InnoDB's FULLTEXT took them before.
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

/** The longest word kept in the search index; longer ones are cut (and typed ones the same way). */
export const WORD_MAX = 40;

/** The distinct words a build is found by: those of its title, story and part names. */
export function buildWords(title: string, story: string, partsText: string): string[] {
	return [...new Set(words(`${title} ${story} ${partsText}`).map((w) => w.slice(0, WORD_MAX)))];
}
