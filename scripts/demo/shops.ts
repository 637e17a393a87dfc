// The invented shops' pages: what they do, two of them checked and stamped by the admin, each
// named (with the owner's agreement) on a handful of the demo members' published builds, and one
// request still waiting. Logos are drawn here as simple lettered plates. Safe to run again.
import sharp from 'sharp';
import { Op } from 'sequelize';
import { models } from '../../src/lib/server/db/models';
import * as users from '../../src/lib/server/auth/users';
import { setLogo } from '../../src/lib/server/shops/logo';

const PAGES = [
	{
		email: 'counter@ridgeway-works.test',
		region: 'Ridgeway valley',
		services:
			'Big-bore kits fitted and run in, case and transfer-port matching, squish set by solder, jetting on the road and on the rollers.',
		openingNote: 'Weekday evenings and Saturday mornings. Ring first.',
		verified: true,
		letters: 'RW'
	},
	{
		email: 'bench@harbourlane.test',
		region: 'Harbour side',
		services:
			'CVT setup: rollers, springs, clutch, variators. Final-drive gear swaps. Speed runs on a closed course.',
		openingNote: 'By appointment.',
		verified: false,
		letters: 'HL'
	},
	{
		email: 'hello@copperbank-cycles.test',
		region: 'Copperbank',
		services:
			'Stock-to-70 cc builds for commuters, with brake upgrades first. Customer handover with a full build sheet.',
		openingNote: '',
		verified: false,
		letters: 'CB'
	},
	{
		email: 'desk@northgate-pipe.test',
		region: 'Northgate uplands (1,400 m)',
		services:
			'Expansion chambers made and tuned. Retuning jetting for riders who live higher or lower than where the engine was set up.',
		openingNote: 'Mountain workshop; expect thin-air figures.',
		verified: true,
		letters: 'NP'
	}
];

async function plate(letters: string): Promise<Buffer> {
	const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="240" height="240">
	<rect width="240" height="240" rx="18" fill="#fbf8f1"/>
	<rect x="14" y="14" width="212" height="212" rx="12" fill="none" stroke="#a8471f" stroke-width="8"/>
	<text x="120" y="150" font-family="monospace" font-size="92" font-weight="700" text-anchor="middle" fill="#2a2926">${letters}</text>
</svg>`;
	return sharp(Buffer.from(svg)).png().toBuffer();
}

export async function seedShops(): Promise<number> {
	const { Shop, ShopLink, Build, User } = models();
	const admin = await User.findOne({ where: { role: 'admin' } });
	const published = await Build.findAll({
		where: { publication: 'published', ownerId: { [Op.ne]: null } },
		attributes: ['id', 'ownerId'],
		order: [['id', 'ASC']]
	});
	let added = 0;
	for (const [i, p] of PAGES.entries()) {
		const owner = await users.readByEmail(p.email);
		if (!owner || (await Shop.findOne({ where: { ownerId: owner.id } }))) continue;
		const shop = await Shop.create({
			ownerId: owner.id,
			name: owner.name ?? p.letters,
			region: p.region,
			services: p.services,
			openingNote: p.openingNote,
			verifiedAt: p.verified && admin ? new Date() : null
		});
		await setLogo(shop, await plate(p.letters));
		// Every fourth published build from an offset, not the shop's own, up to seven.
		const picks = published.filter((b, j) => j % 4 === i && b.ownerId !== owner.id).slice(0, 8);
		for (const [k, b] of picks.entries())
			await ShopLink.create({
				buildId: b.id,
				shopId: shop.id,
				kind: k % 3 === 0 ? 'tuned' : 'built',
				state: k === picks.length - 1 ? 'requested' : 'approved',
				requestedBy: owner.id,
				decidedAt: k === picks.length - 1 ? null : new Date()
			});
		added++;
	}
	return added;
}
