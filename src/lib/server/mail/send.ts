import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '../env';
import { enqueue, setDeliverer } from './queue';

let transport: Transporter | null = null;
let transportUrl = '';

export function mailer(): Transporter {
	const url = env().SMTP_URL;
	if (!transport || transportUrl !== url) {
		// ignoreTLS: the local fake speaks plain SMTP; a real relay URL (smtps://…) still uses TLS.
		transport = nodemailer.createTransport(url, {
			ignoreTLS: url.startsWith('smtp://127.0.0.1'),
			// A relay that is down or frozen fails the attempt quickly; the queue tries again later.
			connectionTimeout: 10_000,
			greetingTimeout: 10_000,
			socketTimeout: 30_000
		});
		transportUrl = url;
	}
	return transport;
}

export type Letter = {
	to: string;
	subject: string;
	text: string;
	html?: string;
	headers?: Record<string, string>;
};

/** Hands one letter to the relay now. Only the queue calls this; everything else calls send. */
export async function deliver(letter: Letter): Promise<void> {
	const result = await mailer().sendMail({ from: env().MAIL_FROM, ...letter });
	if (result.rejected.length) throw new Error(`mail to ${letter.to} was refused`);
}
setDeliverer(deliver);

/** Sends a letter: it is queued in the database (mail-queue.ts) and goes out from there. */
export async function send(letter: Letter): Promise<void> {
	await enqueue(letter);
}

export async function pingMail(): Promise<void> {
	await mailer().verify();
}

const esc = (s: string) =>
	s.replace(
		/[&<>"']/g,
		(c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!
	);

/**
 * The one layout for every mail we send: paragraphs, an optional button-like link, a quiet
 * footer, and for notification mails a one-click unsubscribe link (also in the List-Unsubscribe
 * header, RFC 2369, so mail clients can offer it). Always a plain-text part; HTML beside it.
 */
export function compose(opts: {
	to: string;
	subject: string;
	paragraphs: string[];
	action?: { label: string; url: string } | { label: string; url: string }[];
	footer?: string;
	unsubscribeUrl?: string;
}): Letter {
	const actions = opts.action ? [opts.action].flat() : [];
	const text = [
		...opts.paragraphs,
		...actions.map((a) => `${a.label}: ${a.url}`),
		...(opts.footer ? [opts.footer] : []),
		...(opts.unsubscribeUrl ? [`Stop these mails: ${opts.unsubscribeUrl}`] : []),
		'— Squishline'
	].join('\n\n');
	const p = (t: string) => `<p>${esc(t).replace(/\n/g, '<br>')}</p>`;
	const html = `<div style="font-family:sans-serif;color:#2a2926;max-width:32rem">
${opts.paragraphs.map(p).join('\n')}
${actions.map((a) => `<p><a href="${esc(a.url)}" style="color:#a8471f;font-weight:600">${esc(a.label)}</a></p>`).join('\n')}
${opts.footer ? `<p style="font-size:13px;color:#55524b">${esc(opts.footer)}</p>` : ''}
${opts.unsubscribeUrl ? `<p style="font-size:12px;color:#55524b"><a href="${esc(opts.unsubscribeUrl)}" style="color:#55524b">Stop these mails</a></p>` : ''}
<p>— Squishline</p></div>`;
	const headers = opts.unsubscribeUrl
		? {
				'List-Unsubscribe': `<${opts.unsubscribeUrl}>`,
				// RFC 8058: the provider may POST to that link without asking the reader anything.
				'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click'
			}
		: undefined;
	return { to: opts.to, subject: opts.subject, text, html, headers };
}

/** A plain letter with one link: readable as text, tidy as HTML. */
export function linkLetter(opts: {
	to: string;
	subject: string;
	intro: string;
	url: string;
	action: string;
	outro: string;
}): Letter {
	return compose({
		to: opts.to,
		subject: opts.subject,
		paragraphs: [opts.intro],
		action: { label: opts.action, url: opts.url },
		footer: opts.outro
	});
}
