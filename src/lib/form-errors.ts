/**
 * What a form says when the server could not take it (a 503 with its reason, or a fault of
 * ours), shown beside the form that keeps what was typed instead of leaving the page.
 */
export function failureWords(result: { status?: number; error: { message?: string } }): string {
	if (result.status === 503 && result.error.message) return result.error.message;
	if (result.status === 413 && result.error.message) return result.error.message;
	return 'We could not take that just now; nothing was saved. Try again in a minute.';
}
