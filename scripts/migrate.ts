// Applies pending migrations to the database named in the environment.
import { closeDb } from '../src/lib/server/db/connection';
import { migrator } from '../src/lib/server/db/migrator';

const done = await migrator().up();
console.log(
	done.length ? `  applied ${done.map((m) => m.name).join(', ')}` : '  schema up to date'
);
await closeDb();
