import { spawn } from 'node:child_process';
import type { ChildProcess } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, freshAddress } from '../security/support/app';
import {
	alive,
	root,
	Server,
	settings,
	startCluster,
	stopCluster,
	until,
	useClusterDatabase,
	type Ready
} from './topology';

// The faults the cluster must survive (nginx, two app processes, a primary and a replica), run
// against the real topology. Reads and writes go through nginx unless a test names a process.

let launcher: ChildProcess;
let ready: Ready;
let primary: Server;
let replica: Server;
let lib: Awaited<ReturnType<typeof load>>;

async function load() {
	useClusterDatabase();
	const [factories, fixtures, models, digest, comments, events, mail, connection] =
		await Promise.all([
			import('../support/factories'),
			import('../support/moderation-fixtures'),
			import('../../src/lib/server/db/models'),
			import('../../src/lib/server/comments/digest'),
			import('../../src/lib/server/comments/comments'),
			import('../support/events'),
			import('../support/mail'),
			import('../../src/lib/server/db/connection')
		]);
	return {
		...factories,
		...fixtures,
		...models,
		...digest,
		...comments,
		...events,
		...mail,
		...connection
	};
}

beforeAll(async () => {
	({ child: launcher, ready } = await startCluster());
	primary = new Server(settings.DB_DATA_DIR, ready.primary);
	replica = new Server(settings.DB_REPLICA_DATA_DIR, ready.replica);
	lib = await load();
}, 180_000);

afterAll(async () => {
	await lib?.closeDb();
	if (launcher) await stopCluster(launcher);
}, 90_000);

const app = (i: number) => `http://127.0.0.1:${ready.apps[i].port}`;
/** A browser on the site, connecting to nginx or straight to one app process. */
const browser = (base = ready.origin, address = freshAddress()) =>
	new Client(ready.origin, address, base);

async function signedIn(base: string, email: string, password: string) {
	const c = browser(base);
	const res = await c.signIn(email, password);
	// Signed in: sent on to the bench (Auth.js's own redirect).
	expect([res.status, res.headers.get('location')]).toEqual([302, `${ready.origin}/bench`]);
	return c;
}

/** The same member's browser, now reaching another process. */
function sameBrowserAt(c: Client, base: string) {
	const other = new Client(ready.origin, c.address, base);
	for (const [k, v] of c.cookies) other.cookies.set(k, v);
	return other;
}

async function firstNote(c: Client, buildId: number): Promise<string> {
	const res = await c.fetch(`/api/builds/${buildId}?n=${Math.random()}`);
	expect(res.status).toBe(200);
	const body = (await res.json()) as { sheet: { setups: { changeNote: string }[] } };
	return body.sheet.setups[0].changeNote;
}

async function saveNote(c: Client, buildId: number, setupId: number, note: string) {
	const { version } = (await lib.models().Setup.findByPk(setupId))!;
	return c.fetch(`/api/builds/${buildId}/setups/${setupId}`, {
		method: 'PATCH',
		headers: { 'content-type': 'application/json' },
		body: JSON.stringify({ changeNote: note, version })
	});
}

/** Waits until the replica has applied everything the primary has written so far. */
async function replicaCaughtUp() {
	const [{ pos }] = await primary.sql<{ pos: string }>('SELECT @@gtid_binlog_pos AS pos');
	const [{ r }] = await replica.sql<{ r: number }>(`SELECT MASTER_GTID_WAIT('${pos}', 30) AS r`);
	expect(r).toBe(0);
}

/**
 * Waits until a read through `base` is answered by the replica: with the replica's applier held
 * back, a marker written on the primary must not show (the replica still has the older note).
 */
async function readsFromReplica(base: string, buildId: number, setupId: number) {
	const setNote = (note: string) =>
		primary.sql(
			`UPDATE ${settings.DB_NAME}.setups SET change_note = '${note.replace(/'/g, "''")}' WHERE id = ${setupId}`
		);
	await until(
		'reads go to the replica',
		async () => {
			await replicaCaughtUp();
			const before = await firstNote(browser(base), buildId);
			await replica.sql('STOP SLAVE SQL_THREAD');
			try {
				await setNote(`marker ${Date.now()}`);
				return (await firstNote(browser(base), buildId)) === before;
			} finally {
				await setNote(before);
				await replica.sql('START SLAVE SQL_THREAD');
			}
		},
		20_000
	);
	await replicaCaughtUp();
}

describe('a cluster of two app processes over a primary and a replica', () => {
	it('shows a member their own saved setup at once on another process, and others once the replica has it', async () => {
		const owner = await lib.makeUser();
		const { build, setupId } = await lib.publishedBuild(owner.id, 'Cluster fixture');
		const viaOne = await signedIn(app(0), owner.email, owner.password);
		const viaTwo = sameBrowserAt(viaOne, app(1));
		const reader = browser(app(1));
		await until(
			'the replica has the build',
			async () => (await firstNote(reader, build.id)) === 'Kit on'
		);

		// Hold the replica back: it receives the change but does not apply it yet.
		await replica.sql('STOP SLAVE SQL_THREAD');
		try {
			const saved = await saveNote(viaOne, build.id, setupId, 'Reed block swapped');
			expect(saved.status, await saved.text()).toBe(200);
			for (const [k, v] of viaOne.cookies) viaTwo.cookies.set(k, v);
			expect(viaTwo.cookies.get('sl_written')).toMatch(/^\d+-\d+-\d+/);
			// The member, on the other process: their own change, straight away.
			expect(await firstNote(viaTwo, build.id)).toBe('Reed block swapped');
			// Someone else reads the replica, which has not applied it yet.
			expect(await firstNote(reader, build.id)).toBe('Kit on');
		} finally {
			await replica.sql('START SLAVE SQL_THREAD');
		}
		await until(
			'others see it',
			async () => (await firstNote(reader, build.id)) === 'Reed block swapped'
		);
	});

	it('refuses the sixth wrong password whichever process the tries reach', async () => {
		const member = await lib.makeUser();
		for (let i = 0; i < 5; i++) {
			const res = await browser(app(i % 2)).signIn(member.email, 'not the password');
			expect(res.status).toBe(400);
		}
		// The right password now, from a new address, on either process: the account is locked.
		for (const i of [0, 1]) {
			const res = await browser(app(i)).signIn(member.email, member.password);
			expect(res.status).toBe(429);
			expect(await res.text()).toContain('Too many wrong passwords for this account');
		}
	});

	it('sends each comment digest once when two processes sweep at the same moment', async () => {
		const owner = await lib.makeUser();
		const other = await lib.makeUser();
		const { build } = await lib.publishedBuild(owner.id, 'Two processes sweep');
		const t0 = new Date();
		for (const body of ['Which reed petals?', 'And the jet after?'])
			await lib.createComment(lib.asUser(other), build, { body }, freshAddress(), t0);
		const at = String(t0.getTime() + 61 * 60_000);
		const sweep = () =>
			new Promise<number | null>((resolve) => {
				const c = spawn(process.execPath, ['--import', 'tsx', 'tests/cluster/sweep.ts', at], {
					cwd: root,
					env: { ...process.env },
					stdio: 'inherit'
				});
				c.once('exit', resolve);
			});
		expect(await Promise.all([sweep(), sweep()])).toEqual([0, 0]);
		const mails = await lib.deliveredTo(owner.email);
		expect(mails).toHaveLength(1);
		expect(mails[0].subject).toBe('2 new comments on “Two processes sweep”');
	});

	it('reads from the primary while the replica is stopped, and from the replica again once it is back', async () => {
		const owner = await lib.makeUser();
		const { build, setupId } = await lib.publishedBuild(owner.id, 'Replica away');
		const member = await signedIn(ready.origin, owner.email, owner.password);
		const reader = browser(app(0));
		await until(
			'the replica has the build',
			async () => (await firstNote(reader, build.id)) === 'Kit on'
		);
		await replica.stop();
		try {
			for (const base of [app(0), app(1), ready.origin]) {
				const c = browser(base);
				expect(await firstNote(c, build.id)).toBe('Kit on');
				const page = await c.fetch(`/builds/${build.id}?n=${Math.random()}`);
				expect(page.status).toBe(200);
				expect(await page.text()).toContain('Replica away');
			}
			// Saving goes on meanwhile, and the member sees it.
			const saved = await saveNote(member, build.id, setupId, 'Saved while the replica was away');
			expect(saved.status).toBe(200);
			expect(await firstNote(member, build.id)).toBe('Saved while the replica was away');
		} finally {
			await replica.start();
		}
		// Back, it catches up with what was written while it was away.
		await replicaCaughtUp();
		const [row] = await replica.sql<{ note: string }>(
			`SELECT change_note AS note FROM ${settings.DB_NAME}.setups WHERE id = ${setupId}`
		);
		expect(row.note).toBe('Saved while the replica was away');
		// Once its pause is over, each process reads from the replica again.
		await readsFromReplica(app(0), build.id, setupId);
	});

	it('reads from the primary while the replica answers but lags, and from the replica once it has caught up', async () => {
		const owner = await lib.makeUser();
		const { build, setupId } = await lib.publishedBuild(owner.id, 'Replica behind');
		const member = await signedIn(ready.origin, owner.email, owner.password);
		await replicaCaughtUp();
		// Process 2 reads from the replica (an earlier test may have set it aside for a moment).
		await readsFromReplica(app(1), build.id, setupId);
		await replica.sql('STOP SLAVE SQL_THREAD');
		try {
			const saved = await saveNote(member, build.id, setupId, 'Newer than the replica');
			expect(saved.status).toBe(200);
			// Someone else: the replica's old copy at first, the primary's once the replica is
			// further behind than DB_REPLICA_MAX_LAG_S (5 s) — while it still has not applied it.
			expect(await firstNote(browser(app(1)), build.id)).toBe('Kit on');
			await until(
				'readers leave the lagging replica',
				async () => (await firstNote(browser(app(1)), build.id)) === 'Newer than the replica',
				12_000
			);
		} finally {
			await replica.sql('START SLAVE SQL_THREAD');
		}
		await replicaCaughtUp();
		await readsFromReplica(app(1), build.id, setupId);
	});

	it('answers writes with 503 and keeps reading while the primary is stopped, then writes again', async () => {
		const owner = await lib.makeUser();
		const { build, setupId } = await lib.publishedBuild(owner.id, 'Primary away');
		const member = await signedIn(ready.origin, owner.email, owner.password);
		const { version } = (await lib.models().Setup.findByPk(setupId))!;
		// The replica holds everything written before the primary stops.
		await replicaCaughtUp();
		await primary.stop();
		try {
			const res = await member.fetch(`/api/builds/${build.id}/setups/${setupId}`, {
				method: 'PATCH',
				headers: { 'content-type': 'application/json' },
				body: JSON.stringify({ changeNote: 'Never stored', version })
			});
			expect(res.status).toBe(503);
			expect(await res.text()).toContain('nothing was saved');
			// Readers, and the member, still read (from the replica).
			expect(await firstNote(browser(), build.id)).toBe('Kit on');
			const page = await member.fetch(`/builds/${build.id}`);
			expect(page.status).toBe(200);
		} finally {
			await primary.start();
		}
		// Nothing half-written, and the same app processes write again.
		const stored = (await lib.models().Setup.findByPk(setupId))!;
		expect([stored.changeNote, stored.version]).toEqual(['Kit on', version]);
		const again = await until('a write succeeds again', async () => {
			const r = await saveNote(member, build.id, setupId, 'Stored after the restart');
			return r.status === 200 ? r : null;
		});
		expect(again.status).toBe(200);
		expect(await firstNote(member, build.id)).toBe('Stored after the restart');
	});

	it('routes around an app process killed by its pid', async () => {
		const owner = await lib.makeUser();
		const { build, setupId } = await lib.publishedBuild(owner.id, 'One process down');
		// Readers read the replica: let it have the new build first (a build published a moment
		// ago is "not found" there until it arrives).
		await replicaCaughtUp();
		const victim = ready.apps[0].pid;
		process.kill(victim, 'SIGKILL');
		await until('the process is gone', async () => !alive(victim));
		const answers = await Promise.all(
			Array.from({ length: 20 }, (_, i) =>
				browser()
					.fetch(i % 2 ? `/api/builds/${build.id}?k=${i}` : `/builds/${build.id}?k=${i}`)
					.then((r) => r.status)
			)
		);
		expect(answers).toEqual(Array(20).fill(200));
		// Signing in and saving reach the survivor too.
		const member = await signedIn(ready.origin, owner.email, owner.password);
		const res = await saveNote(member, build.id, setupId, 'Saved on the survivor');
		expect(res.status, await res.text()).toBe(200);
		expect(await firstNote(member, build.id)).toBe('Saved on the survivor');
	});
});
