import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signUp } from '../../src/lib/server/accounts/flows';
import { db } from '../../src/lib/server/db/connection';
import * as users from '../../src/lib/server/auth/users';
import { deliver } from '../../src/lib/server/mail/send';
import { backoffMs, flushMailQueue } from '../../src/lib/server/mail/queue';
import type { Letter } from '../../src/lib/server/mail/send';
import { deliveredTo } from '../support/mail';
import { Client, startApp, type App } from './support/app';

// The mail relay down: forms answer at once, nothing is lost, each letter goes once.
const liveRelay = process.env.SMTP_URL!;
const deadRelay = 'smtp://127.0.0.1:9'; // the discard port: nothing listens here

const queued = (to: string) =>
	db().query<{ attempts: number; sent_at: Date | null; next_attempt_at: Date }>(
		'SELECT attempts, sent_at, next_attempt_at FROM mail_queue WHERE to_address = ? ORDER BY id',
		{ replacements: [to], type: QueryTypes.SELECT }
	);

let app: App;
beforeAll(async () => {
	app = await startApp(3194, { SMTP_URL: deadRelay });
});
afterAll(async () => {
	process.env.SMTP_URL = liveRelay;
	await app?.stop();
});

describe('with the mail relay down', () => {
	it('sign-up and reset answer at once over HTTP; the letters wait in the queue', async () => {
		const email = `down-${Date.now()}@tests.squishline.test`;
		const c = new Client(app.origin);
		const t0 = Date.now();
		const joined = await c.form('/signup', {
			name: 'Relay Down',
			email,
			password: 'a long enough password',
			confirm: 'a long enough password',
			terms: 'true'
		});
		expect(joined.status).toBe(303);
		expect(joined.headers.get('location')).toBe('/signup/check-mail');
		const reset = await new Client(app.origin).form('/reset', { email });
		expect(reset.status).toBe(200);
		expect(await reset.text()).toContain('a reset link is on its way');
		expect(Date.now() - t0).toBeLessThan(5_000);
		// The app's own sweep tried and failed; both letters are still there to retry.
		await expect
			.poll(async () => (await queued(email)).every((r) => r.attempts >= 1), { timeout: 10_000 })
			.toBe(true);
		const rows = await queued(email);
		expect(rows).toHaveLength(2);
		expect(rows.every((r) => r.sent_at === null)).toBe(true);
	});

	it('a failed letter is retried with backoff and goes out once the relay is back', async () => {
		process.env.SMTP_URL = deadRelay;
		const email = `retry-${Date.now()}@tests.squishline.test`;
		await signUp({ name: 'Retry Later', email, password: 'another long password' });
		const now = new Date();
		await flushMailQueue(now);
		const [row] = await queued(email);
		expect(row.attempts).toBe(1);
		expect(row.next_attempt_at.getTime()).toBeGreaterThanOrEqual(
			now.getTime() + backoffMs(1) - 1000
		);

		process.env.SMTP_URL = liveRelay;
		// Not before its time…
		await flushMailQueue(now);
		expect((await queued(email))[0].sent_at).toBeNull();
		// …and then it goes.
		await flushMailQueue(new Date(now.getTime() + backoffMs(1) + 1000));
		expect((await queued(email))[0].sent_at).not.toBeNull();
		const [mail] = await deliveredTo(email);
		expect(mail.subject).toBe('Confirm your address for Squishline');
	});

	it('an account whose confirmation never came can ask again, by joining again or by the form', async () => {
		process.env.SMTP_URL = liveRelay;
		const email = `again-${Date.now()}@tests.squishline.test`;
		await signUp({ name: 'Asks Again', email, password: 'yet another password' });
		await signUp({ name: 'Asks Again', email, password: 'yet another password' });
		const mails = await deliveredTo(email);
		expect(mails.map((m) => m.subject)).toEqual([
			'Confirm your address for Squishline',
			'Confirm your address for Squishline'
		]);
		expect((await users.readByEmail(email))?.emailVerified).toBeNull();

		const asked = await new Client(app.origin).form('/verify/again', { email });
		expect(asked.status).toBe(200);
		expect((await queued(email)).length).toBe(3);
	});

	it('two sweeps at once send each letter once', async () => {
		const email = `once-${Date.now()}@tests.squishline.test`;
		for (let i = 0; i < 5; i++)
			await db().query(
				'INSERT INTO mail_queue (to_address, letter, next_attempt_at, created_at) VALUES (?, ?, ?, ?)',
				{
					replacements: [
						email,
						JSON.stringify({ to: email, subject: `n${i}`, text: 't' } satisfies Letter),
						// Due only for this test's clock, so the app's own sweep leaves them alone.
						new Date(Date.now() + 3600_000),
						new Date()
					]
				}
			);
		const delivered: string[] = [];
		const slow = async (l: Letter) => {
			await new Promise((r) => setTimeout(r, 20));
			if (l.to === email) delivered.push(l.subject);
			else await deliver(l);
		};
		const later = new Date(Date.now() + 2 * 3600_000);
		await Promise.all([flushMailQueue(later, slow), flushMailQueue(later, slow)]);
		expect(delivered.sort()).toEqual(['n0', 'n1', 'n2', 'n3', 'n4']);
	});
});
