import { expect, test, type Page } from '@playwright/test';
import { QueryTypes } from 'sequelize';
import type { CurrentUser } from '../../src/lib/server/auth/current-user';
import { createComment } from '../../src/lib/server/comments/comments';
import { db } from '../../src/lib/server/db/connection';
import * as builds from '../../src/lib/server/sheet/builds';
import * as users from '../../src/lib/server/auth/users';
import { decide } from '../../src/lib/server/review/desk';
import { fileReport } from '../../src/lib/server/review/reports';
import { saveShop } from '../../src/lib/server/shops/pages';
import { addPart, saveRun, saveSetup } from '../../src/lib/server/sheet/service';
import { setPublication } from '../../src/lib/server/sheet/build-service';
import { signInWithPassword } from '../e2e/support';
import { anyAddress, makeUser } from '../support/factories';
import { FIXTURE_SETUP, fixtureRun } from '../support/sheet-fixtures';
import { PAYLOADS } from './payloads';

// Every payload through every field a member, a shop or a moderator can write, rendered in
// Chromium on the pages that show it: nothing runs, no element keeps an event handler or a
// script URL, and nothing a member wrote is positioned over the page.

test.describe.configure({ mode: 'serial' });
test.setTimeout(120_000);

const N = PAYLOADS.length;
const p = (i: number, max = 500) => PAYLOADS[i % N].slice(0, max);

type Seeded = {
	builds: number[];
	commentIds: number[];
	moderatorId: string;
	shops: number[];
	owner: { email: string; password: string };
	moderator: { email: string; password: string };
};
let seeded: Seeded;

const asCurrent = async (id: string): Promise<CurrentUser> => {
	const u = (await users.read(id))!;
	return {
		id,
		email: u.email,
		name: u.name ?? '',
		role: u.role,
		units: 'metric',
		theme: 'device',
		suspension: null
	};
};

async function seed(): Promise<Seeded> {
	const now = new Date();
	const ownerRows = await Promise.all(Array.from({ length: 14 }, () => makeUser()));
	for (const [k, o] of ownerRows.entries()) await users.update(o.id, { name: p(k, 80) });
	const ids: number[] = [];
	for (let i = 0; i < N; i++) {
		const owner = ownerRows[i % ownerRows.length];
		const b = await builds.create(owner.id, {
			title: p(i, 120),
			chassis: p(i + 1, 120),
			engineFamily: p(i + 2, 120),
			story: `${p(i + 3, 5000)}\n\n${p(i + 4, 5000)}`
		});
		const s = (await saveSetup(b.id, { ...FIXTURE_SETUP, changeNote: p(i + 5, 200) })) as {
			id: number;
		};
		await saveRun(b.id, s.id, { ...fixtureRun(60 + (i % 20)), notes: p(i + 6, 5000) });
		await addPart(b.id, { category: 'exhaust', name: p(i + 7, 160), cost: '10', link: '' });
		await setPublication((await builds.read(b.id))!, 'published');
		ids.push(b.id);
	}
	// Comments: ten per member (the comment limit), each body a payload.
	const commenters = await Promise.all(Array.from({ length: 14 }, () => makeUser()));
	const commentIds: number[] = [];
	for (let i = 0; i < N; i++) {
		const who = await asCurrent(commenters[i % commenters.length].id);
		const b = (await builds.read(ids[i]))!;
		const c = await createComment(who, b, { body: p(i + 8, 5000) }, `10.77.${i % 14}.1`, now);
		commentIds.push(c.id);
	}
	// Reports with notes, and the desk taking some down with a public reason.
	const reporters = await Promise.all(Array.from({ length: 2 }, () => makeUser()));
	for (let i = 0; i < 20; i++) {
		const who = await asCurrent(reporters[i % 2].id);
		await fileReport(
			who,
			{ type: 'comment', id: commentIds[i] },
			{ reason: 'other', note: p(i + 9, 1000) },
			now,
			anyAddress()
		);
	}
	const mod = await makeUser({ role: 'moderator' });
	const cases = await db().query<{ id: number }>(
		"SELECT id FROM review_cases WHERE item_type = 'comment' AND item_id IN (?) ORDER BY id",
		{ replacements: [commentIds.slice(0, 10)], type: QueryTypes.SELECT }
	);
	const me = await asCurrent(mod.id);
	for (const [k, c] of cases.entries())
		await decide(me, c.id, { action: 'hide', reason: p(k + 10, 500) }, now);
	// Shop pages.
	const shops: number[] = [];
	for (let k = 0; k < 4; k++) {
		const owner = await makeUser({ role: 'shop' });
		const shop = await saveShop(await asCurrent(owner.id), {
			name: p(k * 4, 120),
			region: p(k * 4 + 1, 120),
			services: p(k * 4 + 2, 2000),
			openingNote: p(k * 4 + 3, 500)
		});
		shops.push(shop.id);
	}
	return {
		builds: ids,
		shops,
		owner: ownerRows[0],
		moderator: mod,
		moderatorId: mod.id,
		commentIds
	};
}

/** Clears the cases this suite opened, so the desk other tests use shows theirs first. */
async function closeOpenCases(s: Seeded) {
	const me = await asCurrent(s.moderatorId);
	const open = await db().query<{ id: number }>(
		"SELECT id FROM review_cases WHERE item_type = 'comment' AND item_id IN (?) AND on_desk = 1",
		{ replacements: [s.commentIds], type: QueryTypes.SELECT }
	);
	for (const c of open) await decide(me, c.id, { action: 'dismiss', reason: '' }, new Date());
}

/** Counts dialogs and flag writes; installed before any page script. */
async function watch(page: Page) {
	const hits: string[] = [];
	page.on('dialog', async (d) => {
		hits.push(`dialog: ${d.message()}`);
		await d.dismiss();
	});
	await page.addInitScript(() => {
		const w = window as unknown as Record<string, unknown>;
		w.__xss_hits = 0;
		const bump = () => {
			w.__xss_hits = Number(w.__xss_hits) + 1;
		};
		for (const f of ['alert', 'confirm', 'prompt', 'print']) w[f] = bump;
		Object.defineProperty(window, '__xss_ran', { set: bump, get: () => undefined });
	});
	return hits;
}

/** What must never be on a page: handlers, script URLs, positioned or structural user elements. */
async function problemsOn(page: Page): Promise<string[]> {
	return page.evaluate(() => {
		const bad: string[] = [];
		const urlAttrs = new Set([
			'href',
			'src',
			'action',
			'formaction',
			'xlink:href',
			'data',
			'srcdoc'
		]);
		for (const el of document.querySelectorAll('*')) {
			for (const a of el.attributes) {
				if (/^on/i.test(a.name)) bad.push(`${el.tagName} ${a.name}`);
				if (
					urlAttrs.has(a.name.toLowerCase()) &&
					/^\s*(javascript|vbscript|data:text\/html)/i.test(a.value)
				)
					bad.push(`${el.tagName} ${a.name}=${a.value.slice(0, 40)}`);
			}
		}
		for (const el of document.querySelectorAll('.prose-sheet *')) {
			const pos = getComputedStyle(el).position;
			if (pos !== 'static' && pos !== 'relative') bad.push(`positioned ${el.tagName} (${pos})`);
			if (el.hasAttribute('style') || el.hasAttribute('class') || el.hasAttribute('id'))
				bad.push(`styled ${el.tagName}`);
		}
		const structural =
			'.prose-sheet :is(style, link, meta, base, form, iframe, object, embed, svg, math, input, button, script)';
		for (const el of document.querySelectorAll(structural)) bad.push(`element ${el.tagName}`);
		// The middle of the screen belongs to the page, never to something a member wrote.
		const mid = document.elementFromPoint(innerWidth / 2, innerHeight / 2);
		if (mid?.closest('.prose-sheet') && mid.textContent?.includes('OVERLAY'))
			bad.push('an overlay covers the page');
		const w = window as unknown as { __xss_hits: number };
		if (w.__xss_hits) bad.push(`${w.__xss_hits} script executions`);
		return bad;
	});
}

async function visit(page: Page, hits: string[], paths: string[]) {
	const found: Record<string, string[]> = {};
	for (const path of paths) {
		const res = await page.goto(path, { waitUntil: 'load' });
		expect(res?.status(), path).toBeLessThan(400);
		await page.mouse.move(200, 300); // hover handlers, had any survived
		const bad = await problemsOn(page);
		if (bad.length) found[path] = bad;
	}
	expect(found).toEqual({});
	expect(hits).toEqual([]);
}

test.beforeAll(async () => {
	test.setTimeout(300_000);
	seeded = await seed();
	expect(N).toBeGreaterThanOrEqual(100);
});

test('build pages: title, chassis, engine, story, setup note, run notes, part names, comments, owner names', async ({
	page
}) => {
	const hits = await watch(page);
	await visit(
		page,
		hits,
		seeded.builds.map((id) => `/builds/${id}`)
	);
});

test('lists, search, side by side and shop pages', async ({ page }) => {
	const hits = await watch(page);
	const four = (k: number) => seeded.builds.slice(k, k + 4).join(',');
	await visit(page, hits, [
		'/builds',
		'/builds?view=table',
		'/builds?sort=newest&view=cards',
		'/builds?q=script',
		'/builds?q=img',
		`/side-by-side?builds=${four(0)}`,
		`/side-by-side?builds=${four(4)}`,
		`/side-by-side?builds=${four(8)}`,
		'/shops',
		...seeded.shops.map((id) => `/shops/${id}`),
		'/speed-map',
		'/change-effects',
		'/close'
	]);
});

test("the owner's bench and the review desk with notes and public reasons", async ({ page }) => {
	const hits = await watch(page);
	await signInWithPassword(page, seeded.owner.email, seeded.owner.password, '/bench');
	await page.waitForURL('**/bench');
	await visit(page, hits, ['/bench', `/builds/${seeded.builds[0]}`]);
	await page.context().clearCookies();
	await signInWithPassword(page, seeded.moderator.email, seeded.moderator.password, '/review');
	await page.waitForURL('**/review');
	await visit(page, hits, ['/review', '/review/log', '/review/log?order=oldest']);
});

test.afterAll(async () => {
	if (seeded) await closeOpenCases(seeded);
});

test('the checks themselves notice a handler, a script URL, a run script and an overlay', async ({
	page
}) => {
	const hits = await watch(page);
	// A page of its own without our CSP, so the planted handler really runs.
	await page.route('http://self-check.test/', (r) =>
		r.fulfill({
			contentType: 'text/html',
			body:
				'<main><p>page</p></main><div class="prose-sheet">' +
				'<div style="position:fixed;inset:0;background:#fff">OVERLAY</div>' +
				'<a href="javascript:void 0">x</a><img src="x" onerror="alert(1)"></div>'
		})
	);
	await page.goto('http://self-check.test/');
	await expect.poll(() => page.evaluate(() => (window as never)['__xss_hits'])).toBe(1);
	const bad = await problemsOn(page);
	expect(bad).toEqual(
		expect.arrayContaining([
			'IMG onerror',
			'A href=javascript:void 0',
			'positioned DIV (fixed)',
			'styled DIV',
			'an overlay covers the page',
			'1 script executions'
		])
	);
	expect(hits).toEqual([]);
});
