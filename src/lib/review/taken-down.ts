/** The desk's public reason as one sentence (a reason typed with its own full stop keeps one). */
export function reasonSentence(reason: string | null): string {
	const r = (reason ?? '').trim().replace(/[.。!?…\s]+$/u, '');
	return `${r || 'no reason given'}.`;
}

export function takenDownMessage(reason: string | null): string {
	return `Taken down by the review desk: ${reasonSentence(reason)}`;
}
