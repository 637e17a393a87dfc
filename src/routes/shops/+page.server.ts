import { listShops } from '$lib/server/shops/pages';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const shops = await listShops();
	return {
		shops: shops.map((s) => ({
			id: s.id,
			name: s.name,
			region: s.region,
			services: s.services,
			verified: s.verifiedAt !== null,
			logo: s.logoKey !== null
		}))
	};
};
