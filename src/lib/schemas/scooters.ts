import { z } from 'zod';

/** `/scooters` and `GET /api/scooters`: a typed name to find, typos forgiven. */
export const scooterQuerySchema = z.object({ q: z.string().trim().max(80).optional() });

/** A scooter's builds, a page at a time: `before` is the last build id of the page before. */
export const scooterPageSchema = z.object({
	before: z.coerce.number().int().positive().optional()
});

/** The catalogue's scooter a new build starts from: an id, or nothing (empty in a form). */
export const startFromSchema = z.object({
	baseScooterId: z.preprocess(
		(v) => (v === '' || v === undefined ? null : v),
		z.coerce.number().int().positive().nullable()
	)
});

const blank = (v: unknown) => (v === '' || v === null ? undefined : v);
const num = (min: number, max: number, what: string) =>
	z.preprocess(
		blank,
		z.coerce
			.number({ error: `${what} must be a number.` })
			.min(min, `${what} is at least ${min}.`)
			.max(max, `${what} is at most ${max}.`)
			.optional()
	);
const whole = (min: number, max: number, what: string) =>
	z.preprocess(
		blank,
		z.coerce
			.number({ error: `${what} must be a whole number.` })
			.int(`${what} must be a whole number.`)
			.min(min, `${what} is at least ${min}.`)
			.max(max, `${what} is at most ${max}.`)
			.optional()
	);
const text = (max: number) => z.preprocess(blank, z.string().trim().max(max).optional());

/**
 * A scooter missing from the catalogue, as a member proposes it: its name and years, its engine
 * (one of the catalogue's families, or a new one described in full), and what they know of its
 * stock drivetrain. Metric units, as the catalogue keeps them.
 */
export const proposeScooterSchema = z
	.object({
		maker: z.string().trim().min(2, 'Write the maker.').max(60),
		model: z.string().trim().min(1, 'Write the model.').max(80),
		yearFrom: whole(1950, 2100, 'The first year'),
		yearTo: whole(1950, 2100, 'The last year'),
		familyId: whole(1, 2 ** 31 - 1, 'The engine family'),
		familyName: text(80),
		engineCycle: z.preprocess(blank, z.enum(['two-stroke', 'four-stroke']).optional()),
		cooling: z.preprocess(blank, z.enum(['air', 'liquid']).optional()),
		cylinderOrientation: z.preprocess(blank, z.enum(['horizontal', 'vertical']).optional()),
		boreMm: num(20, 100, 'The bore'),
		strokeMm: num(20, 100, 'The stroke'),
		carbBoreMm: num(8, 40, 'The carburettor bore'),
		primaryDriver: whole(8, 40, 'Teeth'),
		primaryDriven: whole(15, 80, 'Teeth'),
		secondaryDriver: whole(8, 40, 'Teeth'),
		secondaryDriven: whole(15, 80, 'Teeth'),
		cvtLowRatio: num(1, 4, 'The low CVT ratio'),
		cvtTopRatio: num(0.5, 1.5, 'The top CVT ratio'),
		rollerCount: whole(3, 8, 'The roller count'),
		rollerWeightG: num(2, 30, 'The roller weight'),
		rearTyre: text(30),
		restrictors: text(300),
		peakRpm: whole(3000, 14000, 'The power peak'),
		stockSpeedKmh: num(10, 200, 'The stock top speed'),
		stockSpeedSource: text(300)
	})
	.superRefine((d, ctx) => {
		if (d.yearFrom === undefined)
			ctx.addIssue({ code: 'custom', path: ['yearFrom'], message: 'Write the first year.' });
		if (d.yearFrom !== undefined && d.yearTo !== undefined && d.yearTo < d.yearFrom)
			ctx.addIssue({
				code: 'custom',
				path: ['yearTo'],
				message: 'The last year comes after the first.'
			});
		if (d.familyId !== undefined) return;
		const missing = (
			[
				['familyName', 'the engine’s name'],
				['engineCycle', 'its cycle'],
				['cooling', 'its cooling'],
				['cylinderOrientation', 'its cylinder'],
				['boreMm', 'its bore'],
				['strokeMm', 'its stroke']
			] as const
		).filter(([k]) => d[k] === undefined);
		for (const [k, words] of missing)
			ctx.addIssue({
				code: 'custom',
				path: [k],
				message: `Pick the engine from the list, or write ${words}.`
			});
	});
export type ProposeScooter = z.output<typeof proposeScooterSchema>;

/** The desk's answer to a proposal: into the catalogue, or declined with a reason. */
export const scooterDecisionSchema = z.object({
	scooterId: z.coerce.number().int().positive(),
	decision: z.enum(['accept', 'decline']),
	reason: z.string().trim().max(300).default('')
});
