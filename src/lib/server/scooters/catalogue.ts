import { Op, QueryTypes } from 'sequelize';
import { Failure } from '../../failure';
import { roleAllows, type Role } from '../../roles';
import { familyView, scooterName, type BaseScooterView } from '../../scooters/catalogue';
import { scooterSearch } from '../../scooters/search';
import { listRows, type ListRow } from '../search/build-list';
import { db } from '../db/connection';
import { parseJson, scalar } from '../db/nested';
import { models, type BaseScooter } from '../db/models';

// The catalogue of base scooters: who sees which entry, the search, and a scooter's builds.
// Listed entries are public; a proposed one is seen by its proposer and the moderators.

export type Viewer = { id: string; role: Role } | null;

export function scooterView(row: BaseScooter): BaseScooterView {
	const f = row.family!;
	const stages: [number, number][] = [];
	if (row.primaryDriver && row.primaryDriven) stages.push([row.primaryDriver, row.primaryDriven]);
	if (row.secondaryDriver && row.secondaryDriven)
		stages.push([row.secondaryDriver, row.secondaryDriven]);
	return {
		id: row.id,
		maker: row.maker,
		model: row.model,
		yearFrom: row.yearFrom,
		yearTo: row.yearTo ?? null,
		family: familyView({
			id: f.id,
			name: f.name,
			engineCycle: f.engineCycle,
			cooling: f.cooling,
			cylinderOrientation: f.cylinderOrientation,
			boreMm: f.boreMm,
			strokeMm: f.strokeMm
		}),
		carbBoreMm: row.carbBoreMm ?? null,
		finalDrive: stages,
		cvtLowRatio: row.cvtLowRatio ?? null,
		cvtTopRatio: row.cvtTopRatio ?? null,
		rollerCount: row.rollerCount ?? null,
		rollerWeightG: row.rollerWeightG ?? null,
		rearTyre: row.rearTyre,
		restrictors: row.restrictors,
		peakRpm: row.peakRpm ?? null,
		stockSpeedKmh: row.stockSpeedKmh ?? null,
		stockSpeedSource: row.stockSpeedSource,
		state: row.state
	};
}

const seesProposals = (v: Viewer) => Boolean(v && roleAllows(v.role, 'moderator'));

/** Every entry the viewer may see, by maker and model: the listed ones and their own proposals. */
export async function catalogue(viewer: Viewer = null): Promise<BaseScooterView[]> {
	const { BaseScooter, EngineFamily } = models();
	const mine = viewer ? [{ state: 'proposed', proposedBy: viewer.id }] : [];
	const rows = await BaseScooter.findAll({
		where: { [Op.or]: [{ state: 'listed' }, ...mine] },
		include: [{ model: EngineFamily, as: 'family' }],
		order: [
			['maker', 'ASC'],
			['model', 'ASC'],
			['yearFrom', 'ASC']
		]
	});
	return rows.map(scooterView);
}

/** The catalogue searched by a typed name (typos forgiven), best match first; all when empty. */
export async function findScooters(typed: string, viewer: Viewer = null) {
	return scooterSearch(await catalogue(viewer))(typed);
}

/** One entry, or 404 for one the viewer may not see. */
export async function readScooter(id: number, viewer: Viewer = null): Promise<BaseScooterView> {
	const { BaseScooter, EngineFamily } = models();
	const row = await BaseScooter.findByPk(id, {
		include: [{ model: EngineFamily, as: 'family' }]
	});
	const visible =
		row &&
		(row.state === 'listed' ||
			seesProposals(viewer) ||
			(row.state === 'proposed' && viewer && row.proposedBy === viewer.id));
	if (!visible) throw new Failure(404, 'No such base scooter.');
	return scooterView(row);
}

export const SCOOTER_PAGE = 24;

/**
 * The published builds on a scooter, newest first, a page at a time by key (`before` an id): one
 * walk of builds_by_scooter and one query for the rows.
 */
export async function scooterBuilds(
	scooterId: number,
	before: number | null = null
): Promise<{ builds: ListRow[]; next: number | null }> {
	const ids = await db().query<{ id: number }>(
		`SELECT id FROM builds FORCE INDEX (builds_by_scooter)
		WHERE base_scooter_id = :scooterId AND publication = 'published' AND moderation = 'visible'
		${before ? 'AND id < :before' : ''} ORDER BY id DESC LIMIT :limit`,
		{ replacements: { scooterId, before, limit: SCOOTER_PAGE + 1 }, type: QueryTypes.SELECT }
	);
	const page = ids.slice(0, SCOOTER_PAGE).map((r) => Number(r.id));
	return {
		builds: await listRows(page),
		next: ids.length > SCOOTER_PAGE ? page.at(-1)! : null
	};
}

/** What a lookup gave, or null when it was refused (404, 422); a database failure still throws. */
export async function unlessRefused<T>(lookup: Promise<T>): Promise<T | null> {
	try {
		return await lookup;
	} catch (e) {
		if (e instanceof Failure && (e.status === 404 || e.status === 422)) return null;
		throw e;
	}
}

/**
 * The scooter a member may start a build from: a listed one, or one they proposed themselves. Any
 * other id is refused on the field, so the form shows it beside the picker.
 */
export async function usableScooter(id: number, ownerId: string): Promise<BaseScooterView> {
	try {
		const s = await readScooter(id, { id: ownerId, role: 'member' });
		if (s.state !== 'declined') return s;
	} catch (e) {
		if (!(e instanceof Failure) || e.status !== 404) throw e;
	}
	throw new Failure(422, 'Pick a scooter from the catalogue.', [
		{ path: 'baseScooterId', message: 'Pick a scooter from the catalogue.' }
	]);
}

export type ScooterLink = { id: number; name: string; listed: boolean };

/**
 * A build's base scooter as `{ id, name, listed }` in one column of a page's SELECT (db/nested.ts;
 * replacement `buildId`), or null.
 */
export const scooterColumn = () =>
	scalar(
		`(SELECT JSON_ARRAY(bs.id, bs.maker, bs.model, bs.year_from, bs.year_to, bs.state)
		FROM builds b JOIN base_scooters bs ON bs.id = b.base_scooter_id WHERE b.id = :buildId)`,
		(v): ScooterLink | null => {
			const r = parseJson(v) as [number, string, string, number, number | null, string] | null;
			if (!r) return null;
			const [id, maker, model, yearFrom, yearTo, state] = r;
			return {
				id,
				name: scooterName({ maker, model, yearFrom, yearTo }),
				listed: state === 'listed'
			};
		}
	);

/** Every engine family by name, for choosing one. */
export async function familyChoices(): Promise<{ id: number; name: string }[]> {
	const rows = await models().EngineFamily.findAll({
		attributes: ['id', 'name'],
		order: [['name', 'ASC']]
	});
	return rows.map((f) => ({ id: f.id, name: f.name }));
}
