// How close-builds scores distance. Each term is weight × min(|difference| / scale, CAP), so one
// wildly different column cannot drown the rest; a term whose input is left empty drops out.
// Scales are "one unit of difference": roughly what a tuner would call a different class of build.

export const CAP = 3;

export const TERMS = {
	/** 10 cc separates a 50 from a 60 and a 70: the biggest single factor in top speed. */
	displacement: { weight: 3, scale: 10 },
	/** Pipe type is categorical: the same or not (1 unit). An expansion chamber changes everything above 7,000 rpm. */
	exhaust: { weight: 2, scale: 1 },
	/** 2 mm of carburettor bore is one size step (12 → 14 → 17 → 19 mm). */
	carb: { weight: 1, scale: 2 },
	/** 10 % in final-drive ratio is roughly a one-tooth change on the primary pair. */
	finalDrive: { weight: 1.5, scale: 1 },
	/** 60 mm of rolling circumference is one tyre size (10 → 12 inch is ~150 mm). */
	tyre: { weight: 1, scale: 60 },
	/** 3 g across the whole roller set is about one weight step per roller (0.5 g × 6). */
	rollers: { weight: 1, scale: 3 },
	/** 4 sea-level-equivalent sizes of main jet is a clearly different mixture. */
	jet: { weight: 0.75, scale: 4 },
	/** 1,000 m of elevation is about 10 % less air: jetting and power differ. */
	elevation: { weight: 0.75, scale: 1000 }
} as const;

/**
 * How many candidates close builds reads: the setups nearest the target's displacement (or
 * carburettor bore), `perWalk` each way from it, among those with the target's pipe type and among
 * all (and those tied with the last, `ties` at most); without either, the `newest` listed
 * setups. Stock engines crowd within a cc or two of 49 cc: ranking a few hundred of the nearest
 * by the other terms gives the same list as ranking tens of thousands, and a denser community
 * only narrows the band they come from (half a cc of displacement is worth 0.15 of score, less
 * than one roller step).
 */
export const BAND = { perWalk: 200, ties: 1000, newest: 2000 };
