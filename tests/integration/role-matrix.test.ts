import { isHttpError, isRedirect } from '@sveltejs/kit';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CurrentUser } from '../../src/lib/server/auth/current-user';
import { closeDb } from '../../src/lib/server/db/connection';
import { models } from '../../src/lib/server/db/models';
import { addPart } from '../../src/lib/server/sheet/service';
import { destroyBuild } from '../../src/lib/server/sheet/build-service';
import { asUser, fakeEvent } from '../support/events';
import { makeUser } from '../support/factories';
import { publishedBuild } from '../support/moderation-fixtures';

// The access matrix: every route that changes data, found by reading the route files themselves,
// called as each kind of visitor, each expected to get exactly one status. A new mutating route or
// action that is not listed in MATRIX fails the first test, so nobody can add one unexamined.

afterAll(async () => {
	// The fixtures are published builds; take them away so they do not crowd other suites' lists,
	// through the service, so the summaries kept on write lose them too.
	if (people)
		for (const b of await models().Build.findAll({ where: { ownerId: people.author.id } }))
			await destroyBuild(b.id);
	if (shopId) await models().Shop.destroy({ where: { id: shopId } });
	await closeDb();
});

type Handler = (event: never) => unknown;
const serverFiles = import.meta.glob<Record<string, Handler>>('../../src/routes/**/+server.ts');
const pageFiles = import.meta.glob<{ actions?: Record<string, Handler> }>(
	'../../src/routes/**/+page.server.ts'
);
const MUTATING = ['POST', 'PUT', 'PATCH', 'DELETE'];
// Route ids are listed without their param matchers: `/builds/[id=id]` is `/builds/[id]` here.
const routeOf = (file: string) =>
	file
		.replace('../../src/routes', '')
		.replace(/\/\+(page\.)?server\.ts$/, '')
		.replace(/\[(\w+)=\w+\]/g, '[$1]') || '/';

async function discover() {
	const found = new Map<string, Handler>();
	for (const [file, load] of Object.entries(serverFiles)) {
		const mod = await load();
		for (const m of MUTATING) if (mod[m]) found.set(`${m} ${routeOf(file)}`, mod[m]);
	}
	for (const [file, load] of Object.entries(pageFiles)) {
		const mod = await load();
		for (const [name, fn] of Object.entries(mod.actions ?? {}))
			found.set(`${routeOf(file)} ?/${name}`, fn);
	}
	return found;
}

// Who may call it. owner: the build's owner (and an admin); author: whoever wrote the item (or
// owns the build a request is about), nobody else (others get 404 so an item's existence is not
// confirmed); shop: whoever acts for the fixture shop; self: any signed-in account, even a
// suspended one (leaving is not posting); admin: admins only.
type Policy = 'public' | 'member' | 'owner' | 'author' | 'moderator' | 'admin' | 'shop' | 'self';
type Spec = {
	policy: Policy;
	ok: number;
	/** Fields sent: the JSON body of an API call or the form of an action. */
	with?: (f: Fixture) => Record<string, string>;
};

/** `ok` is the status for a visitor who may call it, given the (mostly incomplete) body sent. */
const MATRIX: Record<string, Spec> = {
	'POST /api/builds': { policy: 'member', ok: 422 },
	'PATCH /api/builds/[id]': { policy: 'owner', ok: 422 },
	'DELETE /api/builds/[id]': { policy: 'owner', ok: 204 },
	'POST /api/builds/[id]/comments': { policy: 'member', ok: 422 },
	'POST /api/builds/[id]/parts': { policy: 'owner', ok: 422 },
	'DELETE /api/builds/[id]/parts/[partId]': { policy: 'owner', ok: 204 },
	'PUT /api/builds/[id]/parts/[partId]': { policy: 'owner', ok: 422 },
	'POST /api/builds/[id]/photos': { policy: 'owner', ok: 415 },
	'PATCH /api/builds/[id]/photos/[photoId]': {
		policy: 'owner',
		ok: 200,
		with: () => ({ caption: 'Matrix caption' })
	},
	'DELETE /api/builds/[id]/photos/[photoId]': { policy: 'owner', ok: 204 },
	'PUT /api/builds/[id]/photos/order': { policy: 'owner', ok: 422 },
	'PATCH /api/builds/[id]/runs/[runId]': { policy: 'owner', ok: 422 },
	'DELETE /api/builds/[id]/runs/[runId]': { policy: 'owner', ok: 204 },
	'POST /api/builds/[id]/setups': { policy: 'owner', ok: 422 },
	'PATCH /api/builds/[id]/setups/[setupId]': { policy: 'owner', ok: 422 },
	'DELETE /api/builds/[id]/setups/[setupId]': { policy: 'owner', ok: 204 },
	'POST /api/builds/[id]/setups/[setupId]/runs': { policy: 'owner', ok: 422 },
	'POST /api/builds/import': { policy: 'member', ok: 422 },
	'PATCH /api/comments/[commentId]': { policy: 'author', ok: 422 },
	'DELETE /api/comments/[commentId]': { policy: 'author', ok: 204 },
	'POST /api/reports': { policy: 'member', ok: 422 },
	'POST /api/review/notes': { policy: 'moderator', ok: 422 },
	'POST /api/slide-rule/[name]': { policy: 'public', ok: 422 },
	'POST /api/riding-conditions': { policy: 'member', ok: 422 },
	'DELETE /api/riding-conditions/[cardId]': { policy: 'author', ok: 204 },
	'/slide-rule/retune ?/saveCard': { policy: 'member', ok: 400 },
	'/slide-rule/retune ?/deleteCard': {
		policy: 'author',
		ok: 303,
		with: (f) => ({ cardId: String(f.cardId) })
	},

	'/builds/[id] ?/comment': { policy: 'member', ok: 400 },
	'/builds/[id] ?/editComment': {
		policy: 'author',
		ok: 303,
		with: (f) => ({ commentId: String(f.commentId), body: 'Changed words' })
	},
	'/builds/[id] ?/deleteComment': {
		policy: 'author',
		ok: 303,
		with: (f) => ({ commentId: String(f.commentId) })
	},
	// Not taken down, so there is nothing to look at again: 409 for the author.
	'/builds/[id] ?/secondLook': {
		policy: 'author',
		ok: 409,
		with: (f) => ({ itemType: 'comment', itemId: String(f.commentId) })
	},
	'/builds/[id]/edit ?/save': { policy: 'owner', ok: 400 },
	'/builds/[id]/edit ?/addPart': { policy: 'owner', ok: 400 },
	'/builds/[id]/edit ?/removePart': { policy: 'owner', ok: 303 },
	'/builds/[id]/edit ?/addPhoto': { policy: 'owner', ok: 400 },
	'/builds/[id]/edit ?/updatePhoto': {
		policy: 'owner',
		ok: 303,
		with: (f) => ({ photoId: String(f.photoId), caption: 'Matrix caption' })
	},
	'/builds/[id]/edit ?/movePhoto': {
		policy: 'owner',
		ok: 303,
		with: (f) => ({ photoId: String(f.photoId), direction: 'up' })
	},
	'/builds/[id]/edit ?/removePhoto': {
		policy: 'owner',
		ok: 303,
		with: (f) => ({ photoId: String(f.photoId) })
	},
	'/builds/[id]/edit ?/publish': { policy: 'owner', ok: 400 },
	'/builds/[id]/edit ?/unpublish': { policy: 'owner', ok: 303 },
	'/builds/[id]/edit ?/destroy': { policy: 'owner', ok: 303 },
	'/builds/[id]/runs/[runId]/edit ?/save': { policy: 'owner', ok: 400 },
	'/builds/[id]/runs/[runId]/edit ?/remove': { policy: 'owner', ok: 303 },
	'/builds/[id]/parts/[partId]/edit ?/save': { policy: 'owner', ok: 400 },
	'/review/items/[type]/[id] ?/putBack': { policy: 'moderator', ok: 400 },
	'/builds/[id]/parts/[partId]/edit ?/remove': { policy: 'owner', ok: 303 },
	'/builds/[id]/setups/[setupId]/edit ?/save': { policy: 'owner', ok: 400 },
	'/builds/[id]/setups/[setupId]/edit ?/remove': { policy: 'owner', ok: 303 },
	'/builds/[id]/setups/[setupId]/runs/new ?/create': { policy: 'owner', ok: 400 },
	'/builds/[id]/setups/new ?/create': { policy: 'owner', ok: 400 },
	'/builds/new ?/import': { policy: 'member', ok: 400 },
	'/builds/new ?/create': { policy: 'member', ok: 400 },
	'/profile ?/save': { policy: 'member', ok: 400 },
	'/profile ?/signOutEverywhere': { policy: 'member', ok: 303 },
	'/profile ?/password': { policy: 'member', ok: 400 },
	'/report ?/default': { policy: 'member', ok: 400 },
	'/review ?/note': { policy: 'moderator', ok: 400 },
	'/review ?/decide': { policy: 'moderator', ok: 400 },
	'/review ?/scooter': { policy: 'moderator', ok: 400 },
	'/scooters/propose ?/propose': { policy: 'member', ok: 400 },
	'/reset ?/default': { policy: 'public', ok: 400 },
	'/verify/again ?/default': { policy: 'public', ok: 400 },
	'/reset/[token] ?/default': { policy: 'public', ok: 400 },
	'/signin ?/password': { policy: 'public', ok: 400 },
	'/signin ?/link': { policy: 'public', ok: 400 },
	'/signup ?/default': { policy: 'public', ok: 400 },
	'/verify/[token] ?/default': { policy: 'public', ok: 400 },
	'/unsubscribe/[token] ?/default': { policy: 'public', ok: 400 },
	// Auth.js answers sign-out with its own 302.
	'/signout ?/default': { policy: 'public', ok: 302 },

	'/builds/[id] ?/decideLink': {
		policy: 'author',
		ok: 303,
		with: (f) => ({ linkId: String(f.linkId), decision: 'decline' })
	},
	'/builds/[id] ?/unlink': {
		policy: 'author',
		ok: 303,
		with: (f) => ({ linkId: String(f.shownLinkId) })
	},
	'/bench ?/acceptHandover': { policy: 'member', ok: 400 },
	'/links/[token] ?/default': { policy: 'public', ok: 400 },
	'/handover/[token] ?/default': { policy: 'member', ok: 400 },
	'/staff/[token] ?/default': { policy: 'member', ok: 400 },
	'/shops/[id] ?/contact': { policy: 'member', ok: 400 },
	'/shop ?/save': { policy: 'shop', ok: 400 },
	'/shop ?/logo': { policy: 'shop', ok: 400 },
	'/shop ?/removeLogo': { policy: 'shop', ok: 303 },
	'/shop ?/invite': { policy: 'shop', ok: 400 },
	'/shop ?/removeStaff': { policy: 'shop', ok: 400 },
	'/shop ?/requestLink': { policy: 'shop', ok: 400 },
	'/shop ?/offerHandover': { policy: 'shop', ok: 400 },
	'/shop ?/withdrawHandover': { policy: 'shop', ok: 400 },
	'/shop ?/reply': { policy: 'shop', ok: 400 },
	'/profile/delete ?/default': { policy: 'self', ok: 400 },
	'/admin ?/role': { policy: 'admin', ok: 400 },
	'/admin ?/suspend': { policy: 'admin', ok: 400 },
	'/admin ?/lift': { policy: 'admin', ok: 400 },
	'/admin ?/endSessions': { policy: 'admin', ok: 400 },
	'/admin/shops ?/verify': { policy: 'admin', ok: 400 },
	'/admin/shops ?/unverify': { policy: 'admin', ok: 400 }
};

const ROLES = [
	'anonymous',
	'member',
	'author',
	'another member',
	'shop',
	'moderator',
	'admin',
	'suspended member'
] as const;
type Who = (typeof ROLES)[number];

/** The one rule the matrix states: what each kind of visitor gets under each policy. */
function expected(spec: Spec, who: Who, api: boolean): number {
	if (spec.policy === 'public') return spec.ok;
	if (who === 'anonymous') return api ? 401 : 303;
	if (spec.policy === 'self') return spec.ok;
	if (who === 'suspended member') return 403;
	switch (spec.policy) {
		case 'member':
			return spec.ok;
		case 'owner':
			return who === 'author' || who === 'admin' ? spec.ok : 403;
		case 'author':
			return who === 'author' ? spec.ok : 404;
		case 'moderator':
			return who === 'moderator' || who === 'admin' ? spec.ok : 403;
		case 'admin':
			return who === 'admin' ? spec.ok : 403;
		case 'shop':
			return who === 'shop' ? spec.ok : 403;
	}
}

type Fixture = {
	buildId: number;
	setupId: number;
	runId: number;
	partId: number;
	photoId: number;
	commentId: number;
	linkId: number;
	shownLinkId: number;
	cardId: number;
};

let people: Record<Exclude<Who, 'anonymous'>, CurrentUser>;
let shopId: number;

beforeAll(async () => {
	const make = async (role: CurrentUser['role'], suspended = false) => {
		const u = await makeUser({ role });
		const cu = asUser(u, role);
		return suspended ? { ...cu, suspension: { reason: 'matrix', until: null } } : cu;
	};
	people = {
		member: await make('member'),
		author: await make('member'),
		'another member': await make('member'),
		shop: await make('shop'),
		moderator: await make('moderator'),
		admin: await make('admin'),
		'suspended member': await make('member', true)
	};
	const shop = await models().Shop.create({
		ownerId: people.shop.id,
		name: 'Matrix Motor Works',
		services: 'Fixture services'
	});
	shopId = shop.id;
});

/** A fresh published build of the author's with one of everything, for each call. */
async function fixture(): Promise<Fixture> {
	const { build, setupId } = await publishedBuild(people.author.id, 'Matrix fixture');
	await addPart(build.id, { category: 'exhaust', name: 'Matrix pipe', cost: 10 });
	const { Run, Part, Photo } = models();
	const run = await Run.findOne({ where: { setupId } });
	const part = await Part.findOne({ where: { buildId: build.id } });
	const photo = await Photo.create({
		buildId: build.id,
		setupId: null,
		position: 1,
		caption: '',
		displayKey: `matrix/${build.id}/d.jpg`,
		thumbKey: `matrix/${build.id}/t.jpg`,
		width: 10,
		height: 10,
		sourceFormat: 'jpeg'
	});
	// Straight into the table: the fixture is not what the comment rate limit is about.
	const now = new Date();
	const comment = await models().Comment.create({
		buildId: build.id,
		setupId: null,
		parentId: null,
		authorId: people.author.id,
		body: 'Matrix comment',
		createdAt: now,
		updatedAt: now,
		notifiedAt: now
	});
	const link = (state: 'requested' | 'approved') =>
		models().ShopLink.create({
			buildId: build.id,
			shopId,
			kind: 'tuned',
			state,
			requestedBy: people.shop.id
		});
	return {
		buildId: build.id,
		setupId,
		runId: run!.id,
		partId: part!.id,
		photoId: photo.id,
		commentId: comment.id,
		linkId: (await link('requested')).id,
		shownLinkId: (await link('approved')).id,
		cardId: (
			await models().RidingConditions.create({
				userId: people.author.id,
				name: `Matrix place ${build.id}`,
				elevationM: 100,
				tempC: 20,
				humidityPct: 50,
				pressureKpa: null,
				pressureKind: 'sea-level'
			})
		).id
	};
}

function paramsFor(route: string, f: Fixture): Record<string, string> {
	const all: Record<string, string> = {
		id: String(route.startsWith('/shops/') ? shopId : f.buildId),
		setupId: String(f.setupId),
		runId: String(f.runId),
		partId: String(f.partId),
		photoId: String(f.photoId),
		commentId: String(f.commentId),
		cardId: String(f.cardId),
		name: 'gearing',
		type: 'build',
		token: 'not-a-real-token'
	};
	const names = [...route.matchAll(/\[(\w+)\]/g)].map((m) => m[1]);
	return Object.fromEntries(names.map((n) => [n, all[n]]));
}

async function statusOf(fn: Handler, event: unknown): Promise<number> {
	try {
		const r = await fn(event as never);
		if (r instanceof Response) return r.status;
		if (r && typeof r === 'object' && 'status' in r && typeof r.status === 'number')
			return r.status;
		return 200;
	} catch (e) {
		if (isRedirect(e) || isHttpError(e)) return e.status;
		throw e;
	}
}

async function call(key: string, fn: Handler, who: Who, n: number): Promise<number> {
	const spec = MATRIX[key];
	const f = await fixture();
	const api = !key.includes('?/');
	const route = api ? key.split(' ')[1] : key.split(' ')[0];
	const params = paramsFor(route, f);
	const path = route.replace(/\[(\w+)\]/g, (_, p: string) => params[p]);
	const user = who === 'anonymous' ? null : people[who];
	const address = `10.7.${n % 250}.${Math.floor(n / 250) % 250}`;
	const fields = spec.with?.(f) ?? {};
	const sent = api
		? {
				request: {
					method: key.split(' ')[0],
					body: JSON.stringify(fields),
					headers: { 'content-type': 'application/json' }
				}
			}
		: { form: fields };
	const event = fakeEvent({ user, params, path, address, ...sent });
	return statusOf(fn, event);
}

describe('role matrix over every mutating route and action', () => {
	it('lists exactly the routes and actions in the route files', async () => {
		const found = [...(await discover()).keys()].sort();
		expect(found).toEqual(Object.keys(MATRIX).sort());
	});

	it('gives each kind of visitor exactly the intended status', async () => {
		const found = await discover();
		const got: string[] = [];
		const want: string[] = [];
		let n = 0;
		for (const [key, fn] of found) {
			const spec = MATRIX[key];
			if (!spec) continue;
			for (const who of ROLES) {
				const api = !key.includes('?/');
				want.push(`${key} as ${who}: ${expected(spec, who, api)}`);
				got.push(`${key} as ${who}: ${await call(key, fn, who, n++)}`);
			}
		}
		expect(got).toEqual(want);
	}, 240_000);
});
