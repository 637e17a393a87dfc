import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/lib/server/db/connection';
import { setHidden } from '../../src/lib/server/review/items';
import { saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { GET as getBuild } from '../../src/routes/api/builds/[id=id]/+server';
import { GET as getExport } from '../../src/routes/api/builds/[id=id]/export/+server';
import { GET as getCsv } from '../../src/routes/api/builds/[id=id]/runs.csv/+server';
import { asUser, fakeEvent } from '../support/events';
import { makeUser } from '../support/factories';
import { publishedBuild } from '../support/moderation-fixtures';
import { FIXTURE_SETUP, fixtureRun } from '../support/sheet-fixtures';

afterAll(closeDb);

// A setup the review desk took down is gone from the page for readers; the same must hold for
// the JSON, the export and the CSV, or the take-down is only cosmetic.
describe('a taken-down setup in the other formats', () => {
	it('is left out for readers and kept for its owner and moderators', async () => {
		const owner = await makeUser();
		const moderator = await makeUser({ role: 'moderator' });
		const reader = await makeUser();
		const { build } = await publishedBuild(owner.id, 'Formats fixture');
		const bad = (await saveSetup(build.id, {
			...FIXTURE_SETUP,
			changeNote: 'Front brake removed for speed'
		})) as { id: number };
		await saveRun(build.id, bad.id, fixtureRun(81));
		await setHidden({ type: 'setup', id: bad.id }, 'advice to ride without a front brake');

		const as = (u: { id: string; email: string } | null, role: 'member' | 'moderator' = 'member') =>
			fakeEvent({
				user: u ? asUser(u, role) : null,
				params: { id: String(build.id) },
				path: `/api/builds/${build.id}`
			});
		const setupsIn = async (r: Response) =>
			((await r.json()) as { setups: { changeNote: string }[] }).setups.map((s) => s.changeNote);
		const csvLines = async (r: Response) => (await r.text()).trim().split('\n').length - 1;

		for (const who of [null, reader]) {
			expect(await setupsIn((await getExport(as(who))) as Response)).toEqual(['Kit on']);
			const json = (await (await getBuild(as(who))).json()) as {
				sheet: { setups: unknown[] };
			};
			expect(json.sheet.setups).toHaveLength(1);
			expect(await csvLines((await getCsv(as(who))) as Response)).toBe(1);
		}
		expect(await setupsIn((await getExport(as(owner))) as Response)).toEqual([
			'Kit on',
			'Front brake removed for speed'
		]);
		expect(await setupsIn((await getExport(as(moderator, 'moderator'))) as Response)).toHaveLength(
			2
		);
		expect(await csvLines((await getCsv(as(owner))) as Response)).toBe(2);
	});
});
