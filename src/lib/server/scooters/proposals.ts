import { UniqueConstraintError } from 'sequelize';
import { Failure } from '../../failure';
import type { ProposeScooter } from '../../schemas/scooters';
import { scooterName } from '../../scooters/catalogue';
import type { CurrentUser } from '../auth/current-user';
import { models } from '../db/models';
import { inTransaction } from '../db/transaction';
import * as log from '../review/log';
import { scooterView } from './catalogue';

// A member proposes a scooter the catalogue lacks (usable on their own sheets at once); the desk
// accepts it into the public catalogue or declines it, each decision logged.

/** Adds the proposal (and its engine family when new) in one transaction; its id. */
export async function proposeScooter(me: CurrentUser, d: ProposeScooter): Promise<number> {
	const { EngineFamily, BaseScooter } = models();
	return inTransaction(async () => {
		let familyId = d.familyId;
		if (familyId !== undefined) {
			if (!(await EngineFamily.findByPk(familyId)))
				throw new Failure(422, 'Pick an engine family from the list.', [
					{ path: 'familyId', message: 'Pick an engine family from the list.' }
				]);
		} else {
			if (await EngineFamily.findOne({ where: { name: d.familyName! } }))
				throw new Failure(409, 'An engine of that name is in the list: pick it there.', [
					{ path: 'familyName', message: 'An engine of that name is in the list: pick it there.' }
				]);
			familyId = (
				await EngineFamily.create({
					name: d.familyName!,
					engineCycle: d.engineCycle!,
					cooling: d.cooling!,
					cylinderOrientation: d.cylinderOrientation!,
					boreMm: d.boreMm!,
					strokeMm: d.strokeMm!
				})
			).id;
		}
		try {
			const s = await BaseScooter.create({
				maker: d.maker,
				model: d.model,
				yearFrom: d.yearFrom!,
				yearTo: d.yearTo ?? null,
				engineFamilyId: familyId,
				carbBoreMm: d.carbBoreMm ?? null,
				primaryDriver: d.primaryDriver ?? null,
				primaryDriven: d.primaryDriven ?? null,
				secondaryDriver: d.secondaryDriver ?? null,
				secondaryDriven: d.secondaryDriven ?? null,
				cvtLowRatio: d.cvtLowRatio ?? null,
				cvtTopRatio: d.cvtTopRatio ?? null,
				rollerCount: d.rollerCount ?? null,
				rollerWeightG: d.rollerWeightG ?? null,
				rearTyre: d.rearTyre ?? '',
				restrictors: d.restrictors ?? '',
				peakRpm: d.peakRpm ?? null,
				stockSpeedKmh: d.stockSpeedKmh ?? null,
				stockSpeedSource: d.stockSpeedSource ?? '',
				state: 'proposed',
				proposedBy: me.id
			});
			return s.id;
		} catch (e) {
			if (!(e instanceof UniqueConstraintError)) throw e;
			throw new Failure(409, 'That scooter is already in the catalogue, or proposed.', [
				{ path: 'model', message: 'That scooter is already in the catalogue, or proposed.' }
			]);
		}
	});
}

/** The proposals waiting for the desk, oldest first, with who proposed each. */
export async function waitingProposals() {
	const { BaseScooter, EngineFamily, User } = models();
	const rows = await BaseScooter.findAll({
		where: { state: 'proposed' },
		include: [{ model: EngineFamily, as: 'family' }],
		order: [['id', 'ASC']],
		limit: 50
	});
	const ids = [...new Set(rows.map((r) => r.proposedBy).filter((x): x is string => Boolean(x)))];
	const names = new Map(
		(await User.findAll({ where: { id: ids }, attributes: ['id', 'name'] })).map((u) => [
			u.id,
			u.name
		])
	);
	return rows.map((r) => ({
		...scooterView(r),
		proposer: (r.proposedBy && names.get(r.proposedBy)) || 'a former member'
	}));
}

/** Accepts a proposal into the public catalogue, or declines it; logged with the reason. */
export async function decideProposal(
	me: CurrentUser,
	d: { scooterId: number; decision: 'accept' | 'decline'; reason: string },
	now: Date
): Promise<void> {
	await inTransaction(async () => {
		const { BaseScooter } = models();
		const row = await BaseScooter.findByPk(d.scooterId);
		if (!row || row.state !== 'proposed')
			throw new Failure(409, 'That proposal was already decided.');
		await row.update({ state: d.decision === 'accept' ? 'listed' : 'declined' });
		await log.append({
			at: now,
			actorId: me.id,
			action: d.decision === 'accept' ? 'scooter-accept' : 'scooter-decline',
			item: { type: 'scooter', id: row.id },
			subjectId: row.proposedBy,
			reason: d.reason,
			detail: { name: scooterName(row) }
		});
	});
}
