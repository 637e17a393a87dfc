import type { QueryInterface } from 'sequelize';
import { SequelizeStorage, Umzug, type MigrationFn } from 'umzug';
import { db } from './connection';
import * as m001 from './migrations/2026.12.01T22.00.00.create-accounts';
import * as m002 from './migrations/2026.12.01T22.10.00.create-email-tokens-and-desk-notes';
import * as m003 from './migrations/2026.12.01T23.00.00.create-builds';
import * as m004 from './migrations/2026.12.01T23.10.00.create-photos';
import * as m005 from './migrations/2026.12.01T23.50.00.close-builds-columns';
import * as m006 from './migrations/2026.12.02T00.05.00.close-builds-exhaust-index';
import * as m007 from './migrations/2026.12.02T03.00.00.close-builds-by-carb';
import * as m008 from './migrations/2026.12.02T04.00.00.stats-and-search';
import * as m009 from './migrations/2026.12.02T06.00.00.moderation';
import * as m010 from './migrations/2026.12.02T11.00.00.shops';
import * as m011 from './migrations/2026.12.02T18.00.00.sessions-and-mail-queue';
import * as m012 from './migrations/2026.12.02T21.00.00.cheapest-by-currency';
import * as m013 from './migrations/2026.12.02T21.30.00.no-news-mail';
import * as m014 from './migrations/2026.12.02T23.40.00.idempotency-keys';
import * as m015 from './migrations/2026.12.03T02.30.00.search-words';
import * as m016 from './migrations/2026.12.03T06.00.00.stat-summaries';
import * as m017 from './migrations/2026.12.03T08.00.00.rate-limits';
import * as m018 from './migrations/2026.12.03T12.00.00.sea-level-jet-dry-air';
import * as m019 from './migrations/2026.12.03T12.30.00.riding-conditions';
import * as m020 from './migrations/2026.12.03T14.10.00.theme';
import * as m021 from './migrations/2026.12.03T14.30.00.run-air-optional';
import * as m022 from './migrations/2026.12.03T17.00.00.public-version';
import * as m023 from './migrations/2026.12.03T17.30.00.list-walks';
import * as m024 from './migrations/2026.12.03T20.00.00.walk-newest';
import * as m025 from './migrations/2026.12.03T20.30.00.base-scooters';
import * as m026 from './migrations/2026.12.03T21.00.00.search-vocabulary';
import * as m027 from './migrations/2026.12.03T21.10.00.whole-cc-by-speed-and-id';

export type Migration = MigrationFn<QueryInterface>;

// Listed by hand rather than globbed: the same list then works under tsx, vitest and a bundle.
const MIGRATIONS = [
	{ name: '2026.12.01T22.00.00.create-accounts', ...m001 },
	{ name: '2026.12.01T22.10.00.create-email-tokens-and-desk-notes', ...m002 },
	{ name: '2026.12.01T23.00.00.create-builds', ...m003 },
	{ name: '2026.12.01T23.10.00.create-photos', ...m004 },
	{ name: '2026.12.01T23.50.00.close-builds-columns', ...m005 },
	{ name: '2026.12.02T00.05.00.close-builds-exhaust-index', ...m006 },
	{ name: '2026.12.02T03.00.00.close-builds-by-carb', ...m007 },
	{ name: '2026.12.02T04.00.00.stats-and-search', ...m008 },
	{ name: '2026.12.02T06.00.00.moderation', ...m009 },
	{ name: '2026.12.02T11.00.00.shops', ...m010 },
	{ name: '2026.12.02T18.00.00.sessions-and-mail-queue', ...m011 },
	{ name: '2026.12.02T21.00.00.cheapest-by-currency', ...m012 },
	{ name: '2026.12.02T21.30.00.no-news-mail', ...m013 },
	{ name: '2026.12.02T23.40.00.idempotency-keys', ...m014 },
	{ name: '2026.12.03T02.30.00.search-words', ...m015 },
	{ name: '2026.12.03T06.00.00.stat-summaries', ...m016 },
	{ name: '2026.12.03T08.00.00.rate-limits', ...m017 },
	{ name: '2026.12.03T12.00.00.sea-level-jet-dry-air', ...m018 },
	{ name: '2026.12.03T12.30.00.riding-conditions', ...m019 },
	{ name: '2026.12.03T14.10.00.theme', ...m020 },
	{ name: '2026.12.03T14.30.00.run-air-optional', ...m021 },
	{ name: '2026.12.03T17.00.00.public-version', ...m022 },
	{ name: '2026.12.03T17.30.00.list-walks', ...m023 },
	{ name: '2026.12.03T20.00.00.walk-newest', ...m024 },
	{ name: '2026.12.03T20.30.00.base-scooters', ...m025 },
	{ name: '2026.12.03T21.00.00.search-vocabulary', ...m026 },
	{ name: '2026.12.03T21.10.00.whole-cc-by-speed-and-id', ...m027 }
];

export function migrator() {
	const sequelize = db();
	return new Umzug({
		migrations: MIGRATIONS.map(({ name, up, down }) => ({ name, up, down })),
		context: sequelize.getQueryInterface(),
		storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
		logger: undefined
	});
}
