import { QueryTypes } from 'sequelize';
import { db } from '../../src/lib/server/db/connection';
import '../../src/lib/server/mail/send';
import { flushMailQueue } from '../../src/lib/server/mail/queue';
import { listMail } from '../../src/lib/server/mail/outbox';

/** Sends what is queued for `to` (waiting out a sweep already under way), then reads the outbox. */
export async function deliveredTo(to: string) {
	for (let i = 0; i < 100; i++) {
		await flushMailQueue(new Date());
		const [row] = await db().query<{ n: number }>(
			`SELECT COUNT(*) AS n FROM mail_queue
			 WHERE to_address = ? AND sent_at IS NULL AND failed_at IS NULL AND next_attempt_at <= ?`,
			{ replacements: [to, new Date()], type: QueryTypes.SELECT }
		);
		if (Number(row.n) === 0) break;
		await new Promise((r) => setTimeout(r, 50));
	}
	return listMail(to);
}
