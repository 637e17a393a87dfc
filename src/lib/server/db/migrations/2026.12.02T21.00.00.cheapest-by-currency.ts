import type { Migration } from '../migrator';

// "Cheapest parts first" orders within one currency: the index leads with it, so a page walks
// only that currency's builds in cost order.
export const up: Migration = async ({ context: q }) => {
	await q.addIndex('builds', ['currency', 'parts_total_minor', 'id'], {
		name: 'builds_currency_parts'
	});
};

export const down: Migration = async ({ context: q }) => {
	await q.removeIndex('builds', 'builds_currency_parts');
};
