import * as builds from '../../src/lib/server/sheet/builds';
import { saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { setPublication } from '../../src/lib/server/sheet/build-service';
import { FIXTURE_SETUP, fixtureRun } from './sheet-fixtures';

/** A published build with one setup and one run, owned by `ownerId`. */
export async function publishedBuild(ownerId: string, title = 'Moderation fixture') {
	const b = await builds.create(ownerId, {
		title,
		chassis: 'Fenwick Lark 12-inch',
		engineFamily: 'fixture family',
		story: 'A plain story.'
	});
	const s = (await saveSetup(b.id, { ...FIXTURE_SETUP, changeNote: 'Kit on' })) as { id: number };
	await saveRun(b.id, s.id, fixtureRun(70));
	const fresh = (await builds.read(b.id))!;
	await setPublication(fresh, 'published');
	return { build: (await builds.read(b.id))!, setupId: s.id };
}
