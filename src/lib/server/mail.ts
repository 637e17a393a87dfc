import nodemailer, { type Transporter } from 'nodemailer';
import { env } from './env';

let transport: Transporter | null = null;
let transportUrl = '';

export function mailer(): Transporter {
	const url = env().SMTP_URL;
	if (!transport || transportUrl !== url) {
		// ignoreTLS: the local fake speaks plain SMTP; a real relay URL (smtps://…) still uses TLS.
		transport = nodemailer.createTransport(url, { ignoreTLS: url.startsWith('smtp://127.0.0.1') });
		transportUrl = url;
	}
	return transport;
}

export type Letter = { to: string; subject: string; text: string; html?: string };

export async function send(letter: Letter): Promise<void> {
	const result = await mailer().sendMail({ from: env().MAIL_FROM, ...letter });
	if (result.rejected.length) throw new Error(`mail to ${letter.to} was refused`);
}

export async function pingMail(): Promise<void> {
	await mailer().verify();
}

const esc = (s: string) =>
	s.replace(
		/[&<>"']/g,
		(c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!
	);

/** A plain letter with one link: readable as text, tidy as HTML. */
export function linkLetter(opts: {
	to: string;
	subject: string;
	intro: string;
	url: string;
	action: string;
	outro: string;
}): Letter {
	const text = `${opts.intro}\n\n${opts.action}: ${opts.url}\n\n${opts.outro}\n\n— Squishline`;
	const html = `<div style="font-family:sans-serif;color:#2a2926;max-width:32rem">
<p>${esc(opts.intro)}</p>
<p><a href="${esc(opts.url)}" style="color:#a8471f;font-weight:600">${esc(opts.action)}</a></p>
<p style="font-size:13px;color:#55524b">${esc(opts.outro)}</p><p>— Squishline</p></div>`;
	return { to: opts.to, subject: opts.subject, text, html };
}
