import type { CurrentUser } from '../auth/current-user';
import { commentsColumn, commentViews } from '../comments/comments';
import type { Build } from '../db/models';
import { scalar, selectColumns } from '../db/nested';
import { buildCasesColumn, pageStanding } from '../review/standing';
import { scooterColumn } from '../scooters/catalogue';
import type { Units } from '../../sheet/units';
import { buildView, sheetColumns } from '../sheet/view';
import { linksColumn, linkViews } from '../shops/links';
import { actingShopColumn } from '../shops/pages';
import { stepsFrom } from '../stats/change-effects';

const none = scalar('NULL', () => null);

/**
 * Everything the build page shows beyond the build row itself, in one SELECT whatever the number
 * of setups, runs, photos and comments (tests/integration/build-page.test.ts counts): the sheet's
 * lists, the owner's name, the shops named on it, the thread, the desk's cases, and for the owner
 * the shops' waiting requests. Each domain writes its own column; this only puts them together.
 */
export async function buildPage(build: Build, me: CurrentUser | null, units: Units, now: Date) {
	const mine = me !== null && me.id === build.ownerId;
	const found = await selectColumns(
		{
			...sheetColumns(),
			shown: linksColumn('approved'),
			pending: mine ? linksColumn('requested') : none,
			comments: commentsColumn(),
			cases: buildCasesColumn(),
			actingShop: me && !me.suspension ? actingShopColumn() : none,
			scooter: scooterColumn()
		},
		{ buildId: build.id, ownerId: build.ownerId, me: me?.id ?? null }
	);
	const view = await buildView(build, units, found, now);
	const shops = linkViews(found.shown);
	const myShop = found.actingShop;
	const standing = pageStanding(
		build,
		view.setups.map((s) => s.id),
		me,
		found.cases
	);
	// A setup the desk took down leaves only its reason for readers who may not see it.
	const takenDown = standing.seesHidden
		? []
		: view.setups
				.filter((s) => s.moderation === 'hidden')
				.map((s) => ({ id: s.id, position: s.position, hiddenReason: s.hiddenReason }));
	if (!standing.seesHidden) view.setups = view.setups.filter((s) => s.moderation !== 'hidden');
	const open = build.publication === 'published' && build.moderation === 'visible';
	return {
		...view,
		steps: stepsFrom(found.setups),
		comments: commentViews(found.comments, found.cases, me),
		standing,
		takenDown,
		shops,
		scooter: found.scooter,
		pendingShops: found.pending ? linkViews(found.pending, true) : [],
		mine,
		canComment: open && !me?.suspension,
		// A shop that acts here may ask to be named, unless it already is.
		askAs: myShop && open && !shops.some((l) => l.shopId === myShop.id) ? myShop.name : null
	};
}
