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

const fmt = new Intl.DateTimeFormat('en-GB', {
	dateStyle: 'long',
	timeStyle: 'short',
	timeZone: 'UTC'
});

export function untilText(s: Suspension): string {
	return s.until ? `until ${fmt.format(new Date(s.until))} UTC` : 'until the desk lifts it';
}

/** What a suspended member is told when they try to change something. */
export function suspensionMessage(s: Suspension): string {
	return `Your account is suspended ${untilText(s)}: ${s.reason}. You can still read and export, but not post, comment, report or message.`;
}
