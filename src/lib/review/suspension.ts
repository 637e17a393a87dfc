export type Suspension = { reason: string; until: string | null };

type Row = {
	suspendedAt: Date | null;
	suspendedUntil: Date | null;
	suspendedReason: string | null;
};

/**
 * The suspension in force at `now`, or null. A suspension with an end lapses by itself: nobody
 * has to lift it, the next request after the end simply finds none.
 */
export function activeSuspension(row: Row, now: Date = new Date()): Suspension | null {
	if (!row.suspendedAt) return null;
	if (row.suspendedUntil && row.suspendedUntil.getTime() <= now.getTime()) return null;
	return {
		reason: row.suspendedReason ?? 'no reason recorded',
		until: row.suspendedUntil ? row.suspendedUntil.toISOString() : null
	};
}

// Made on first use: this module is in every page's scripts, and building a date format at load
// costs a slowed phone over 100 ms before the page can answer a tap.
let fmt: Intl.DateTimeFormat | null = null;

export function untilText(s: Suspension): string {
	fmt ??= new Intl.DateTimeFormat('en-GB', {
		dateStyle: 'long',
		timeStyle: 'short',
		timeZone: 'UTC'
	});
	return s.until ? `until ${fmt.format(new Date(s.until))} UTC` : 'until the desk lifts it';
}

/** What a suspended member is told when they try to change something. */
export function suspensionMessage(s: Suspension): string {
	return `Your account is suspended ${untilText(s)}: ${s.reason}. You can still read and export, but not post, comment, report or message.`;
}
