import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { loadCurrentUser } from '../../src/lib/server/auth/current-user';
import { flushCommentDigests } from '../../src/lib/server/comments/digest';
import { createComment, editComment } from '../../src/lib/server/comments/comments';
import { closeDb, db } from '../../src/lib/server/db/connection';
import * as builds from '../../src/lib/server/sheet/builds';
import { destroyBuild } from '../../src/lib/server/sheet/build-service';
import { models } from '../../src/lib/server/db/models';
import { readCase } from '../../src/lib/server/review/cases';
import { decide, putBack } from '../../src/lib/server/review/desk';
import * as log from '../../src/lib/server/review/log';
import { fileReport } from '../../src/lib/server/review/reports';
import { deskCount, deskCursor, deskQueue } from '../../src/lib/server/review/queue';
import { deliveredTo } from '../support/mail';
import { unsubscribeUrl } from '../../src/lib/server/mail/unsubscribe';
import { actions as unsubscribeActions } from '../../src/routes/unsubscribe/[token]/+page.server';
import { actions as buildActions } from '../../src/routes/builds/[id=id]/+page.server';
import { asUser, fakeEvent } from '../support/events';
import { anyAddress, makeUser } from '../support/factories';
import { publishedBuild } from '../support/moderation-fixtures';

afterAll(closeDb);

const MIN = 60_000;
const address = () => `10.9.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;

async function mailsTo(email: string) {
	return deliveredTo(email);
}

describe('the moderation log', () => {
	it('refuses UPDATE and DELETE from the app database account, and takes INSERTs', async () => {
		const mod = await makeUser({ role: 'moderator' });
		await log.append({ at: new Date(), actorId: mod.id, action: 'warn', reason: 'append test' });
		const [{ id }] = await db().query<{ id: number }>(
			"SELECT id FROM moderation_log WHERE reason = 'append test' ORDER BY id DESC LIMIT 1",
			{ type: QueryTypes.SELECT }
		);
		// 1142 = ER_TABLEACCESS_DENIED_ERROR: the grant is missing, not a rule in our code.
		await expect(
			db().query(`UPDATE moderation_log SET reason = 'changed' WHERE id = ${id}`)
		).rejects.toThrow(/UPDATE command denied/);
		await expect(db().query(`DELETE FROM moderation_log WHERE id = ${id}`)).rejects.toThrow(
			/DELETE command denied/
		);
		// Sequelize's own paths end in the same refusal.
		await expect(
			models().LogEntry.update({ reason: 'changed' }, { where: { id } })
		).rejects.toThrow(/denied/);
		const still = await models().LogEntry.findByPk(id);
		expect(still?.reason).toBe('append test');
	});
});

describe('comment digest (injected clock)', () => {
	it('sends one mail for three comments within the hour, none before the hour is up', async () => {
		const owner = await makeUser();
		const other = await makeUser();
		const { build } = await publishedBuild(owner.id, 'Digest fixture');
		const t0 = new Date();
		const me = asUser(other);
		for (const [i, body] of ['First question', 'Second thought', 'Third note'].entries())
			await createComment(me, build, { body }, address(), new Date(t0.getTime() + i * 10 * MIN));
		const before = (await mailsTo(owner.email)).length;
		await flushCommentDigests(new Date(t0.getTime() + 30 * MIN));
		expect((await mailsTo(owner.email)).length).toBe(before);
		await flushCommentDigests(new Date(t0.getTime() + 61 * MIN));
		const after = await mailsTo(owner.email);
		expect(after.length).toBe(before + 1);
		expect(after[0].subject).toBe('3 new comments on “Digest fixture”');
		for (const words of ['First question', 'Second thought', 'Third note', 'Stop these mails'])
			expect(after[0].text).toContain(words);
		// Nothing new: nothing more to send.
		await flushCommentDigests(new Date(t0.getTime() + 125 * MIN));
		expect((await mailsTo(owner.email)).length).toBe(before + 1);
	});

	it('mails each digest once when several processes sweep at the same moment', async () => {
		const owner = await makeUser();
		const other = await makeUser();
		const { build } = await publishedBuild(owner.id, 'Two sweeps fixture');
		const t0 = new Date();
		await createComment(asUser(other), build, { body: 'Swept twice?' }, address(), t0);
		await createComment(asUser(other), build, { body: 'And again?' }, address(), t0);
		const at = new Date(t0.getTime() + 61 * MIN);
		// Each sweep on its own pool connections, as two app processes would run them.
		await Promise.all([1, 2, 3].map(() => flushCommentDigests(at)));
		const mails = await mailsTo(owner.email);
		expect(mails).toHaveLength(1);
		expect(mails[0].subject).toBe('2 new comments on “Two sweeps fixture”');
	});

	it('the one-click unsubscribe link stops that mail', async () => {
		const owner = await makeUser();
		const other = await makeUser();
		const { build } = await publishedBuild(owner.id, 'Unsubscribe fixture');
		const url = new URL(unsubscribeUrl(owner.id, 'comments'));
		const token = url.pathname.split('/').pop()!;
		const result = await unsubscribeActions.default(
			fakeEvent({ params: { token }, path: url.pathname, form: {} })
		);
		expect(result).toEqual({ done: true });
		expect((await models().User.findByPk(owner.id))?.mailComments).toBe(false);
		const t0 = new Date();
		await createComment(asUser(other), build, { body: 'Hello?' }, address(), t0);
		await flushCommentDigests(new Date(t0.getTime() + 61 * MIN));
		expect(await mailsTo(owner.email)).toHaveLength(0);
		// A forged token changes nothing.
		const forged = await unsubscribeActions.default(
			fakeEvent({ params: { token: `${token.slice(0, -2)}xx` }, path: url.pathname, form: {} })
		);
		expect(forged).toMatchObject({ status: 400 });
	});
});

describe('suspension', () => {
	it('ends by itself: refused while it lasts, allowed again after', async () => {
		const owner = await makeUser();
		const author = await makeUser();
		const mod = await makeUser({ role: 'moderator' });
		const { build } = await publishedBuild(owner.id);
		const t0 = new Date();
		const c = await createComment(asUser(author), build, { body: 'Fine words' }, address(), t0);
		await fileReport(
			asUser(owner),
			{ type: 'comment', id: c.id },
			{ reason: 'spam', note: '' },
			t0,
			anyAddress()
		);
		const kase = await readCase({ type: 'comment', id: c.id });
		await decide(
			asUser(mod, 'moderator'),
			kase!.id,
			{ action: 'suspend', reason: 'spam run', days: 2 },
			t0
		);

		const post = async (at: Date) => {
			const { user } = await loadCurrentUser(author.id, at);
			try {
				return await buildActions.comment(
					fakeEvent({
						user,
						params: { id: String(build.id) },
						path: `/builds/${build.id}`,
						form: { body: 'Back again' },
						address: address()
					})
				);
			} catch (e) {
				return e as { status: number; body?: { message: string }; location?: string };
			}
		};
		const during = (await post(new Date(t0.getTime() + 47 * 3600_000))) as {
			status: number;
			body: { message: string };
		};
		expect(during.status).toBe(403);
		expect(during.body.message).toMatch(/suspended until .*: spam run/);
		const afterwards = (await post(new Date(t0.getTime() + 48 * 3600_000 + 1))) as {
			status: number;
			location: string;
		};
		expect(afterwards.status).toBe(303);
		expect(afterwards.location).toMatch(new RegExp(`/builds/${build.id}#comment-\\d+`));
		const mails = await mailsTo(author.email);
		expect(mails.some((m) => m.subject.includes('suspended') && m.text.includes('spam run'))).toBe(
			true
		);
	});
});

describe('reports, flags and the caution banner', () => {
	it('limits reports in the service itself: the eleventh in an hour from one account is refused', async () => {
		const owner = await makeUser();
		const reporter = asUser(await makeUser());
		const note = { reason: 'spam' as const, note: '' };
		// Ten different builds, so each report is a new one (a repeat would join the first).
		const targets = await Promise.all(
			Array.from({ length: 11 }, (_, i) => publishedBuild(owner.id, `Report limit ${i}`))
		);
		for (const { build } of targets.slice(0, 10))
			await fileReport(reporter, { type: 'build', id: build.id }, note, new Date(), '10.30.0.1');
		await expect(
			fileReport(
				reporter,
				{ type: 'build', id: targets[10].build.id },
				note,
				new Date(),
				'10.30.0.2'
			)
		).rejects.toMatchObject({ status: 429 });
		const filed = await models().Report.count({ where: { reporterId: reporter.id } });
		expect(filed).toBe(10);
		for (const { build } of targets) await destroyBuild(build.id);
	});

	it('one report never raises the banner; three unsafe reporters, a triage or a flag do', async () => {
		const owner = await makeUser();
		const { build } = await publishedBuild(owner.id);
		const ref = { type: 'build' as const, id: build.id };
		const [a, b, c] = await Promise.all([makeUser(), makeUser(), makeUser()]);
		const now = new Date();
		const unsafe = { reason: 'unsafe' as const, note: 'no front brake' };
		expect(await fileReport(asUser(a), ref, unsafe, now, anyAddress())).toEqual({
			filed: true,
			added: false,
			caution: false
		});
		// The same person again: added to their open report, still one reporter.
		expect(await fileReport(asUser(a), ref, unsafe, now, anyAddress())).toEqual({
			filed: true,
			added: true,
			caution: false
		});
		expect((await fileReport(asUser(b), ref, unsafe, now, anyAddress())).caution).toBe(false);
		expect((await fileReport(asUser(c), ref, unsafe, now, anyAddress())).caution).toBe(true);
		expect(await models().Report.count({ where: { itemType: 'build', itemId: build.id } })).toBe(3);
	});

	it('a second report while the first is open adds its note and takes its reason', async () => {
		const owner = await makeUser();
		const { build } = await publishedBuild(owner.id);
		const ref = { type: 'build' as const, id: build.id };
		const r = asUser(await makeUser());
		await fileReport(r, ref, { reason: 'unsafe', note: '' }, new Date(), anyAddress());
		const second = await fileReport(
			r,
			ref,
			{ reason: 'wrong-data', note: 'The jet size is for a different carb.' },
			new Date(),
			anyAddress()
		);
		expect(second).toMatchObject({ filed: true, added: true });
		const rows = await models().Report.findAll({ where: { itemType: 'build', itemId: build.id } });
		expect(rows).toHaveLength(1);
		expect(rows[0].reason).toBe('wrong-data');
		expect(rows[0].note).toBe('The jet size is for a different carb.');
	});

	it('a triage raises it after a single report', async () => {
		const owner = await makeUser();
		const mod = await makeUser({ role: 'moderator' });
		const { build } = await publishedBuild(owner.id);
		const ref = { type: 'build' as const, id: build.id };
		const r = await makeUser();
		await fileReport(asUser(r), ref, { reason: 'wrong-data', note: '' }, new Date(), anyAddress());
		expect((await readCase(ref))?.caution).toBe(false);
		const kase = await readCase(ref);
		await decide(asUser(mod, 'moderator'), kase!.id, { action: 'triage', reason: '' }, new Date());
		expect((await readCase(ref))?.caution).toBe(true);
	});

	it('a text rule in a comment raises a flag and the banner, and hides nothing', async () => {
		const owner = await makeUser();
		const { build } = await publishedBuild(owner.id);
		const c = await createComment(
			asUser(await makeUser()),
			build,
			{ body: 'Honestly, just remove the front brake, it is dead weight.' },
			address(),
			new Date()
		);
		const flags = await models().Flag.findAll({ where: { itemType: 'comment', itemId: c.id } });
		expect(flags.map((f) => f.code)).toEqual(['text:brakes-removed']);
		expect((await readCase({ type: 'comment', id: c.id }))?.caution).toBe(true);
		expect((await models().Comment.findByPk(c.id))?.moderation).toBe('visible');
	});

	it('hide then restore returns a build exactly as it was, publication untouched', async () => {
		const owner = await makeUser();
		const mod = await makeUser({ role: 'moderator' });
		const { build } = await publishedBuild(owner.id);
		const ref = { type: 'build' as const, id: build.id };
		await fileReport(
			asUser(await makeUser()),
			ref,
			{ reason: 'unsafe', note: '' },
			new Date(),
			anyAddress()
		);
		const kase = (await readCase(ref))!;
		const before = (await builds.read(build.id))!.get({ plain: true });
		await decide(
			asUser(mod, 'moderator'),
			kase.id,
			{ action: 'hide', reason: 'no brakes' },
			new Date()
		);
		const hidden = (await builds.read(build.id))!;
		expect([hidden.moderation, hidden.hiddenReason, hidden.publication]).toEqual([
			'hidden',
			'no brakes',
			'published'
		]);
		expect(hidden.story).toBe(before.story);
		await decide(
			asUser(mod, 'moderator'),
			kase.id,
			{ action: 'restore', reason: 'checked again' },
			new Date()
		);
		const back = (await builds.read(build.id))!.get({ plain: true });
		expect({ ...back, updatedAt: null }).toEqual({ ...before, updatedAt: null });
	});

	it('a comment stays editable while under review even after a reply; otherwise a reply locks it', async () => {
		const owner = await makeUser();
		const author = asUser(await makeUser());
		const { build } = await publishedBuild(owner.id);
		const now = new Date();
		const c = await createComment(author, build, { body: 'Try a 92 main' }, address(), now);
		await createComment(asUser(owner), build, { body: 'Thanks', parentId: c.id }, address(), now);
		await expect(editComment(author, c.id, 'Try a 94 main', now)).rejects.toMatchObject({
			status: 409
		});
		await fileReport(
			asUser(await makeUser()),
			{ type: 'comment', id: c.id },
			{ reason: 'wrong-data', note: '' },
			now,
			anyAddress()
		);
		await editComment(author, c.id, 'Try a 94 main', now);
		expect((await models().Comment.findByPk(c.id))?.body).toBe('Try a 94 main');
	});
});

describe('putting back and who is mailed', () => {
	async function takenDown() {
		const owner = await makeUser();
		const mod = asUser(await makeUser({ role: 'moderator' }), 'moderator');
		const { build } = await publishedBuild(owner.id);
		const ref = { type: 'build' as const, id: build.id };
		await fileReport(
			asUser(await makeUser()),
			ref,
			{ reason: 'spam', note: '' },
			new Date(),
			anyAddress()
		);
		const c = (await readCase(ref))!;
		await decide(mod, c.id, { action: 'hide', reason: 'advertising' }, new Date());
		return { owner, mod, build, ref };
	}

	it('puts back an item with no case on the desk, logged with its reason and mailed', async () => {
		const { owner, mod, build, ref } = await takenDown();
		expect((await readCase(ref))!.onDesk).toBe(false);
		await putBack(mod, ref, 'the link was the owner’s own build log', new Date());
		expect((await builds.read(build.id))!.moderation).toBe('visible');
		const lines = await log.list({ itemType: 'build', itemId: build.id, order: 'oldest' });
		expect(lines.map((l) => [l.action, l.reason])).toEqual([
			['hide', 'advertising'],
			['restore', 'the link was the owner’s own build log']
		]);
		const mail = await deliveredTo(owner.email);
		expect(mail.map((m) => m.text).join('\n')).toContain('the owner’s own build log');
	});

	it('a failure writing the log line leaves the item down and the case as it was', async () => {
		const { mod, build, ref } = await takenDown();
		const before = (await readCase(ref))!.get({ plain: true });
		const spy = vi.spyOn(models().LogEntry, 'create').mockRejectedValueOnce(new Error('disk full'));
		try {
			await expect(putBack(mod, ref, 'try', new Date())).rejects.toThrow('disk full');
		} finally {
			spy.mockRestore();
		}
		expect((await builds.read(build.id))!.moderation).toBe('hidden');
		expect((await readCase(ref))!.get({ plain: true })).toEqual(before);
	});

	it('dismissing or triaging a report mails nobody; taking down mails the author', async () => {
		const owner = await makeUser();
		const mod = asUser(await makeUser({ role: 'moderator' }), 'moderator');
		const { build } = await publishedBuild(owner.id);
		const ref = { type: 'build' as const, id: build.id };
		await fileReport(
			asUser(await makeUser()),
			ref,
			{ reason: 'other', note: '' },
			new Date(),
			anyAddress()
		);
		const c = (await readCase(ref))!;
		await decide(mod, c.id, { action: 'triage', reason: '' }, new Date());
		await decide(mod, c.id, { action: 'dismiss', reason: '' }, new Date());
		expect(await deliveredTo(owner.email)).toEqual([]);
		await fileReport(
			asUser(await makeUser()),
			ref,
			{ reason: 'other', note: '' },
			new Date(),
			anyAddress()
		);
		await decide(mod, c.id, { action: 'hide', reason: 'made-up figures' }, new Date());
		expect(await deliveredTo(owner.email)).toHaveLength(1);
	});
});

describe('the desk a page at a time', () => {
	it('pages through every waiting case without overlap, either way round', async () => {
		// Other test files may add or decide cases meanwhile: this file's three cases must each come
		// up exactly once, and no case twice.
		const owner = await makeUser();
		const mine: number[] = [];
		for (let i = 0; i < 3; i++) {
			const { build } = await publishedBuild(owner.id, `Desk page ${i}`);
			const ref = { type: 'build' as const, id: build.id };
			await fileReport(
				asUser(await makeUser()),
				ref,
				{ reason: 'other', note: '' },
				new Date(),
				anyAddress()
			);
			mine.push((await readCase(ref))!.id);
		}
		expect(await deskCount()).toBeGreaterThanOrEqual(3);
		for (const order of ['oldest', 'newest'] as const) {
			const seen: number[] = [];
			let after: string | undefined;
			for (;;) {
				const page = await deskQueue({ order, after, limit: 2 });
				seen.push(...page.map((c) => c.id));
				if (page.length < 2) break;
				after = deskCursor(page.at(-1)!);
			}
			expect(new Set(seen).size).toBe(seen.length);
			for (const id of mine) expect(seen.filter((x) => x === id)).toHaveLength(1);
			// Opened one after another: newest first lists them the other way round.
			const at = mine.map((id) => seen.indexOf(id));
			expect(at).toEqual([...at].sort((a, b) => (order === 'oldest' ? a - b : b - a)));
		}
	});
});
