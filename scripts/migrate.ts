// Applies pending migrations to the database named in the environment.
import { QueryTypes } from 'sequelize';
import { closeDb, db } from '../src/lib/server/db/connection';
import { applyAppGrants } from '../src/lib/server/db/grants';
import { migrator } from '../src/lib/server/db/migrator';
import { refreshSteps } from '../src/lib/server/derived/recompute';

const done = await migrator().up();
console.log(
	done.length ? `  applied ${done.map((m) => m.name).join(', ')}` : '  schema up to date'
);
// The step columns come from the setups' configurations (JSON compared field by field in
// src/lib/sheet/change-kinds.ts), which SQL alone cannot do: fill them for sheets saved before.
if (done.some((m) => m.name === '2026.12.02T04.00.00.stats-and-search')) {
	const ids = await db().query<{ id: number; build_id: number }>(
		'SELECT id, build_id FROM setups ORDER BY build_id, position',
		{ type: QueryTypes.SELECT }
	);
	// The migration filled the best-run columns in SQL; only the steps need the configurations.
	for (const b of new Set(ids.map((s) => s.build_id))) await refreshSteps(b);
	console.log(`  change steps filled for ${ids.length} setups`);
}
// Every run, so a table added by any migration gets the app account's table-level grants.
await applyAppGrants(db().getQueryInterface());
await closeDb();
