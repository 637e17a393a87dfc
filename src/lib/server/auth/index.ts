import SequelizeAdapter from '@auth/sequelize-adapter';
import { CredentialsSignin, SvelteKitAuth, type SvelteKitAuthConfig } from '@auth/sveltekit';
import Credentials from '@auth/sveltekit/providers/credentials';
import Nodemailer from '@auth/sveltekit/providers/nodemailer';
import { db } from '../db/connection';
import { models } from '../db/models';
import * as users from '../db/users';
import { env } from '../env';
import { linkLetter, send } from '../mail';
import { passwordSignInSchema } from '../../schemas/account';
import { verifyPasswordSignIn, type PasswordSignInResult } from './password-signin';

type FailureCode = Extract<PasswordSignInResult, { ok: false }>['code'];

/** Carries our reason through Auth.js so the sign-in form can say what went wrong. */
export class PasswordSignInError extends CredentialsSignin {
	constructor(code: FailureCode) {
		super();
		this.code = code;
	}
}

const QUIET = new Set(['Verification', 'AccessDenied']);

let config: SvelteKitAuthConfig | null = null;

function authConfig(): SvelteKitAuthConfig {
	if (config) return config;
	const m = models();
	const e = env();
	config = {
		trustHost: true,
		secret: e.AUTH_SECRET,
		// Password sign-in works only with JWT sessions; role and suspension are re-read from the
		// database on every request in hooks.server.ts, never trusted from the token.
		session: { strategy: 'jwt', maxAge: 30 * 24 * 3600 },
		adapter: SequelizeAdapter(db(), {
			synchronize: false,
			models: {
				User: m.User as never,
				Account: m.Account as never,
				Session: m.Session as never,
				VerificationToken: m.VerificationToken as never
			}
		}),
		pages: { signIn: '/signin', verifyRequest: '/signin/check-mail', error: '/signin/problem' },
		providers: [
			Credentials({
				id: 'password',
				credentials: { email: {}, password: {} },
				async authorize(credentials) {
					const parsed = passwordSignInSchema.safeParse(credentials);
					if (!parsed.success) throw new PasswordSignInError('credentials');
					const result = await verifyPasswordSignIn(parsed.data.email, parsed.data.password);
					if (!result.ok) throw new PasswordSignInError(result.code);
					return result.user;
				}
			}),
			Nodemailer({
				id: 'link',
				server: e.SMTP_URL,
				from: e.MAIL_FROM,
				maxAge: 24 * 3600,
				normalizeIdentifier: users.normaliseEmail,
				async sendVerificationRequest({ identifier, url }) {
					await send(
						linkLetter({
							to: identifier,
							subject: 'Your Squishline sign-in link',
							intro: 'Someone (we hope you) asked for a link to sign in to Squishline.',
							action: 'Sign in to Squishline',
							url,
							outro:
								'The link works once and for 24 hours. If you did not ask for it, ignore this mail.'
						})
					);
				}
			})
		],
		callbacks: {
			async session({ session, token }) {
				if (token.sub) session.user.id = token.sub;
				return session;
			}
		},
		logger: {
			error(error) {
				// A wrong password, a spent link or a suspended account is the visitor's news, not a fault.
				if (error instanceof CredentialsSignin || QUIET.has(error.name)) return;
				console.error('[auth]', error);
			}
		}
	};
	return config;
}

export const { handle: authHandle, signIn, signOut } = SvelteKitAuth(async () => authConfig());
