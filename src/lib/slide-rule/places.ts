// Places for the retune: a member's saved riding conditions and their logged runs, and how a
// place fills the form's fields in the reader's units.
import * as t from '../tuning';

/** A place as the retune uses it, in SI: where the air comes from and what it was like. */
export type PlaceAir = {
	elevationM: number;
	tempC: number;
	humidityPct: number;
	pressureKpa: number | null;
	pressureKind: 'sea-level' | 'station';
};
export type Card = PlaceAir & { id: number; name: string };
/** One of the member's own logged runs, offered as a place (with the jet it ran). */
export type RunPlace = PlaceAir & {
	id: number;
	label: string;
	mainJet: number | null;
	jetNumbering: 'diameter' | 'flow';
};

/** A place's fields as the retune form shows them, in the reader's units. */
export function placeFields(p: PlaceAir, units: 'metric' | 'imperial'): Record<string, string> {
	const imp = units === 'imperial';
	const r = (v: number, d: number) => String(Number(v.toFixed(d)));
	return {
		elevation: imp ? r(t.mToFt(p.elevationM), 0) : r(p.elevationM, 0),
		temp: imp ? r(t.cToF(p.tempC), 1) : r(p.tempC, 1),
		humidity: r(p.humidityPct, 0),
		pressure:
			p.pressureKpa === null
				? ''
				: imp
					? r(t.kpaToInHg(p.pressureKpa), 2)
					: r(p.pressureKpa * 10, 1),
		pressureKind: p.pressureKind
	};
}

export type Places = { cards: Card[]; runs: RunPlace[] };

/** The place a "fill from" choice names (`card:3`, `run:12`), among the member's own. */
export function chosenPlace(places: Places, choice: string | null): Card | RunPlace | undefined {
	const [kind, id] = (choice ?? '').split(':');
	if (kind === 'card') return places.cards.find((c) => c.id === Number(id));
	if (kind === 'run') return places.runs.find((r) => r.id === Number(id));
	return undefined;
}

/**
 * The retune fields a place fills on one side ("fromElevation", …), in the reader's units; a run
 * filling the jetted-at place brings the jet it ran too.
 */
export function placePatch(
	side: 'from' | 'to',
	p: Card | RunPlace,
	units: 'metric' | 'imperial'
): Record<string, string> {
	const out: Record<string, string> = {};
	for (const [k, v] of Object.entries(placeFields(p, units)))
		out[side + k[0].toUpperCase() + k.slice(1)] = v;
	if (side === 'from' && 'mainJet' in p && p.mainJet !== null) {
		out.jet = String(p.mainJet);
		out.numbering = p.jetNumbering;
	}
	return out;
}
