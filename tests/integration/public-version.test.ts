import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '../../src/lib/server/db/connection';
import { models } from '../../src/lib/server/db/models';
import { movesPublicPages } from '../../src/lib/server/db/public-writes';
import { inTransaction } from '../../src/lib/server/db/transaction';
import { createBuild } from '../../src/lib/server/sheet/build-service';
import { publicVersion } from '../../src/lib/server/web/kept-answers';
import { makeUser } from '../support/factories';

// The number whole anonymous answers are kept under (web/kept-answers.ts) moves on once per
// committed change a page might show, after the commit, and never for a change rolled back or
// for bookkeeping no page reads.

afterAll(closeDb);

describe('public version', () => {
	it('moves once a change commits, once per transaction, not before the commit', async () => {
		const owner = await makeUser();
		const before = await publicVersion();
		let inside = -1;
		await inTransaction(async () => {
			const b = await createBuild(owner.id, { title: 'Version fixture' });
			await db().query('UPDATE builds SET story = :s WHERE id = :id', {
				replacements: { s: 'Edited in the same transaction.', id: b.id }
			});
			inside = await outside();
		});
		expect(inside).toBe(before);
		expect(await publicVersion()).toBe(before + 1);
	});

	it('does not move for a change rolled back', async () => {
		const owner = await makeUser();
		const before = await publicVersion();
		await expect(
			inTransaction(async () => {
				await createBuild(owner.id, { title: 'Rolled back' });
				throw new Error('injected failure after the write');
			})
		).rejects.toThrow('injected failure');
		expect(await publicVersion()).toBe(before);
	});

	it('moves for a write outside a transaction; not for bookkeeping tables', async () => {
		const owner = await makeUser();
		const b = await createBuild(owner.id, { title: 'Autocommit fixture' });
		const before = await publicVersion();
		await models().Build.update(
			{ story: 'Changed without a transaction.' },
			{ where: { id: b.id } }
		);
		expect(await publicVersion()).toBe(before + 1);
		await db().query('DELETE FROM idempotency_keys WHERE 1 = 0');
		await db().query('UPDATE summary_version SET v = v WHERE id = 1');
		expect(await publicVersion()).toBe(before + 1);
	});
});

describe('which statements move it', () => {
	it.each([
		['INSERT INTO `builds` (`title`) VALUES (?)', true],
		['UPDATE `setups` SET `note` = ? WHERE `id` = ?', true],
		['DELETE FROM comments WHERE id = 3', true],
		['DELETE c FROM comments c JOIN builds b ON b.id = c.build_id', true],
		['INSERT IGNORE INTO search_words (word, build_id) VALUES (?, ?)', true],
		['REPLACE INTO shops (id) VALUES (1)', true],
		['TRUNCATE TABLE photos', true],
		['ALTER TABLE builds ADD COLUMN x INT', true],
		['SELECT * FROM builds', false],
		['  (SELECT 1) UNION (SELECT 2)', false],
		['SELECT id FROM setups WHERE build_id = 1 FOR UPDATE', false],
		['START TRANSACTION;', false],
		['SET SESSION TRANSACTION ISOLATION LEVEL READ COMMITTED;', false],
		['COMMIT;', false],
		['UPDATE `sessions` SET `expires` = ?', false],
		['INSERT INTO mail_queue (id) VALUES (1)', false],
		['DELETE FROM rate_limits WHERE expire < NOW()', false],
		['UPDATE public_version SET v = v + 1 WHERE id = 1', false]
	])('%s → %s', (sql, moves) => {
		expect(movesPublicPages(sql)).toBe(moves);
	});
});

/** The version as another connection sees it, from inside a transaction or not. */
async function outside(): Promise<number> {
	const [row] = await db().query<{ v: number }>('SELECT v FROM public_version WHERE id = 1', {
		type: QueryTypes.SELECT,
		transaction: null
	});
	return Number(row.v);
}
