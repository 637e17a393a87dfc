import fs from 'node:fs/promises';
import path from 'node:path';
import { env } from '../env';

// Reads what the local fake mail server kept. Only in the local demo (SQUISHLINE_DEMO, set by
// the launcher alone) with FAKE_MAIL_DIR set: the production entry has no outbox at all, whatever
// else its environment holds.

export type OutboxMail = {
	id: string;
	receivedAt: string;
	envelopeTo: string[];
	from: string;
	to: string;
	subject: string;
	text: string;
	html: string;
};

export function outboxDir(): string | null {
	const e = env();
	return e.SQUISHLINE_DEMO ? (e.FAKE_MAIL_DIR ?? null) : null;
}

export async function listMail(to?: string): Promise<OutboxMail[]> {
	const dir = outboxDir();
	if (!dir) return [];
	const names = (await fs.readdir(dir).catch(() => [] as string[])).filter((n) =>
		n.endsWith('.json')
	);
	names.sort().reverse();
	const mails = await Promise.all(names.slice(0, 200).map((n) => readFile(path.join(dir, n))));
	const wanted = to?.trim().toLowerCase();
	return mails
		.filter((m): m is OutboxMail => m !== null)
		.filter((m) => !wanted || m.envelopeTo.some((a) => a.toLowerCase() === wanted));
}

export async function readMail(id: string): Promise<OutboxMail | null> {
	const dir = outboxDir();
	if (!dir || !/^[\w-]+$/.test(id)) return null;
	return readFile(path.join(dir, `${id}.json`));
}

async function readFile(file: string): Promise<OutboxMail | null> {
	try {
		return JSON.parse(await fs.readFile(file, 'utf8')) as OutboxMail;
	} catch {
		return null;
	}
}

/** The links in a mail's text, so the page can offer them as buttons. */
export function linksIn(text: string): string[] {
	return [...new Set(text.match(/https?:\/\/[^\s<>"]+/g) ?? [])];
}
