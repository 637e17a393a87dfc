/** What a shop-desk form answered: the words, what was typed, and which message it was about. */
export type DeskSlot =
	{ values?: Record<string, string>; message: string; id?: number } | undefined;

/** A link's or a handover's state, in the desk's words. */
export const STATE: Record<string, string> = {
	requested: 'waiting for the owner',
	approved: 'shown on the build',
	declined: 'declined by the owner',
	unlinked: 'removed by the owner',
	pending: 'waiting for the customer',
	accepted: 'taken over by the customer',
	cancelled: 'withdrawn'
};
