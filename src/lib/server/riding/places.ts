import { QueryTypes } from 'sequelize';
import { z } from 'zod';
import { Failure, fieldFailure, parse } from '../../failure';
import { conditions } from '../../slide-rule/air-and-jets';
import { FieldError } from '../../slide-rule/types';
import type { Card, PlaceAir, RunPlace } from '../../slide-rule/places';
import type { CurrentUser } from '../auth/current-user';
import { db } from '../db/connection';
import { models } from '../db/models';
import { inTransaction } from '../db/transaction';

/** The most cards a member keeps: a list to pick from, not a weather log. */
export const MAX_CARDS = 30;

/** A card as typed, in the reader's units (the retune form's place fields). */
export const cardSchema = z.object({
	name: z.string().trim().min(1, 'Give the card a name.').max(60, 'At most 60 characters.'),
	units: z.enum(['metric', 'imperial']),
	elevation: z.coerce.number({ error: 'Enter a number.' }),
	temp: z.coerce.number({ error: 'Enter a number.' }),
	humidity: z.coerce.number({ error: 'Enter a number.' }).min(0).max(100),
	pressure: z.preprocess(
		(v) => (v === '' || v === null ? undefined : v),
		z.coerce.number({ error: 'Enter a number.' }).positive().optional()
	),
	pressureKind: z.enum(['station', 'sea-level']).default('sea-level')
});
export type CardInput = z.input<typeof cardSchema>;

const view = (c: InstanceType<ReturnType<typeof models>['RidingConditions']>): Card => ({
	id: c.id,
	name: c.name,
	elevationM: c.elevationM,
	tempC: c.tempC,
	humidityPct: c.humidityPct,
	pressureKpa: c.pressureKpa,
	pressureKind: c.pressureKind
});

export async function listCards(me: CurrentUser): Promise<Card[]> {
	const rows = await models().RidingConditions.findAll({
		where: { userId: me.id },
		order: [['name', 'ASC']]
	});
	return rows.map(view);
}

/** The member's latest logged runs with their air, newest first, for "fill from a run". */
export async function listRunPlaces(me: CurrentUser, limit = 20): Promise<RunPlace[]> {
	const rows = await db().query<{
		id: number;
		run_on: string;
		speed_kmh: number;
		elevation_m: number;
		temp_c: number;
		humidity_pct: number;
		pressure_kpa: number | null;
		pressure_kind: 'sea-level' | 'station';
		title: string;
		config: unknown;
	}>(
		`SELECT r.id, r.run_on, r.speed_kmh, r.elevation_m, r.temp_c, r.humidity_pct, r.pressure_kpa,
			r.pressure_kind, b.title, s.config
		FROM runs r JOIN builds b ON b.id = r.build_id JOIN setups s ON s.id = r.setup_id
		WHERE b.owner_id = :me
			AND r.elevation_m IS NOT NULL AND r.temp_c IS NOT NULL AND r.humidity_pct IS NOT NULL
		ORDER BY r.run_on DESC, r.id DESC LIMIT :limit`,
		{ replacements: { me: me.id, limit }, type: QueryTypes.SELECT }
	);
	return rows.map((r) => {
		const c = (typeof r.config === 'string' ? JSON.parse(r.config) : r.config) ?? {};
		return {
			id: r.id,
			label: `${r.title}, ${String(r.run_on).slice(0, 10)}`,
			elevationM: r.elevation_m,
			tempC: r.temp_c,
			humidityPct: r.humidity_pct,
			pressureKpa: r.pressure_kpa,
			pressureKind: r.pressure_kind,
			mainJet: typeof c.mainJet === 'number' ? c.mainJet : null,
			jetNumbering: c.jetNumbering === 'flow' ? 'flow' : 'diameter'
		};
	});
}

/** The typed place in SI, checked as the retune checks it (the field at fault named, in its units). */
function toAir(i: z.infer<typeof cardSchema>): PlaceAir {
	try {
		const c = conditions(i, i.units === 'imperial');
		return {
			elevationM: c.elevationM,
			tempC: c.tempC,
			humidityPct: c.relativeHumidity * 100,
			pressureKpa: c.pressurePa === undefined ? null : c.pressurePa / 1000,
			pressureKind: c.pressureKind ?? 'station'
		};
	} catch (e) {
		if (e instanceof FieldError) throw fieldFailure(422, e.path, e.message);
		throw e;
	}
}

/**
 * Saves a card under its name: a new name adds one, a name the member already has replaces its
 * values (one place per name). One transaction: the count check and the write stand together.
 */
export async function saveCard(me: CurrentUser, body: unknown): Promise<Card> {
	const input = parse(cardSchema, body);
	const air = toAir(input);
	const { RidingConditions } = models();
	return inTransaction(async () => {
		const mine = await RidingConditions.findAll({ where: { userId: me.id }, lock: true });
		const same = mine.find((c) => c.name.toLowerCase() === input.name.toLowerCase());
		if (same) {
			await same.update({ ...air, name: input.name });
			return view(same);
		}
		if (mine.length >= MAX_CARDS)
			throw new Failure(409, `You keep ${MAX_CARDS} cards at most: remove one first.`);
		return view(await RidingConditions.create({ userId: me.id, name: input.name, ...air }));
	});
}

/** Removes one of the member's cards; someone else's (or none) is "not found", never "forbidden". */
export async function deleteCard(me: CurrentUser, id: number): Promise<void> {
	const n = await models().RidingConditions.destroy({ where: { id, userId: me.id } });
	if (!n) throw new Failure(404, 'No such card.');
}
