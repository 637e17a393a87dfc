// Local stand-in for an SMTP relay: accepts every message on loopback and keeps it as JSON
// in FAKE_MAIL_DIR, where the app's development outbox page reads it.
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { exitWhenOrphaned } from '../scripts/lib/orphan-guard.js';

const port = Number(process.env.SMTP_PORT ?? 2525);
const dir = process.env.FAKE_MAIL_DIR ?? path.resolve('.data/outbox');
fs.mkdirSync(dir, { recursive: true });

const server = new SMTPServer({
	authOptional: true,
	// The package's bundled certificate has expired; plain SMTP on loopback is enough here.
	disabledCommands: ['STARTTLS'],
	logger: false,
	onData(stream, session, callback) {
		simpleParser(stream)
			.then((mail) => {
				const id = `${Date.now()}-${randomUUID().slice(0, 8)}`;
				const record = {
					id,
					receivedAt: new Date().toISOString(),
					envelopeTo: session.envelope.rcptTo.map((r) => r.address),
					from: mail.from?.text ?? '',
					to: mail.to
						? [mail.to]
								.flat()
								.map((t) => t.text)
								.join(', ')
						: '',
					subject: mail.subject ?? '',
					text: mail.text ?? '',
					html: typeof mail.html === 'string' ? mail.html : '',
					headers: Object.fromEntries(
						[...mail.headers].map(([k, v]) => [k, typeof v === 'string' ? v : JSON.stringify(v)])
					)
				};
				const tmp = path.join(dir, `.${id}.tmp`);
				fs.writeFileSync(tmp, JSON.stringify(record, null, 2));
				fs.renameSync(tmp, path.join(dir, `${id}.json`));
				callback();
			})
			.catch((err) => callback(err));
	}
});

server.listen(port, '127.0.0.1', () => {
	console.log(`fake mail server on smtp://127.0.0.1:${port} (messages in ${dir})`);
});

const stop = () => server.close(() => process.exit(0));
process.once('SIGTERM', stop);
process.once('SIGINT', stop);
exitWhenOrphaned(() => new Promise((r) => server.close(r)));
