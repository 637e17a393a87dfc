import SequelizeAdapter from '@auth/sequelize-adapter';
import { CredentialsSignin, SvelteKitAuth, type SvelteKitAuthConfig } from '@auth/sveltekit';
import Credentials from '@auth/sveltekit/providers/credentials';
import Nodemailer from '@auth/sveltekit/providers/nodemailer';
import { db } from '../db/connection';
import { models } from '../db/models';
import * as users from './users';
import { env } from '../env';
import { linkLetter, send } from '../mail/send';
import { passwordSignInSchema } from '../../schemas/account';
import { CLIENT_ADDRESS_HEADER } from './client-address';
import { verifyPasswordSignIn, type PasswordSignInResult } from './password-signin';
import { endSession, openSession, sessionValid } from './sessions';

type FailureCode = Extract<PasswordSignInResult, { ok: false }>['code'];

/** Carries our reason through Auth.js so the sign-in form can say what went wrong. */
export class PasswordSignInError extends CredentialsSignin {
	constructor(code: FailureCode) {
		super();
		this.code = code;
	}
}

const SESSION_MAX_AGE_S = 30 * 24 * 3600;

const QUIET = new Set(['Verification', 'AccessDenied']);

let config: SvelteKitAuthConfig | null = null;

function authConfig(): SvelteKitAuthConfig {
	if (config) return config;
	const m = models();
	const e = env();
	config = {
		// Links are built from AUTH_URL (ORIGIN/auth, set by both launchers); Host is pinned to
		// ORIGIN and forwarded-host headers are dropped before Auth.js runs (origin-check.ts).
		trustHost: true,
		secret: e.AUTH_SECRET,
		useSecureCookies: e.ORIGIN.startsWith('https:'),
		// Password sign-in works only with JWT sessions; role and suspension are re-read from the
		// database on every request in hooks.server.ts, never trusted from the token. The database
		// can still end a session: see sessions.ts.
		session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_S },
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
				async authorize(credentials, request) {
					const parsed = passwordSignInSchema.safeParse(credentials);
					if (!parsed.success) throw new PasswordSignInError('credentials');
					const result = await verifyPasswordSignIn(
						parsed.data.email,
						parsed.data.password,
						request.headers.get(CLIENT_ADDRESS_HEADER) ?? 'unknown'
					);
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
			// Runs at sign-in (with `user`) and on every read of the session: null ends it.
			async jwt({ token, user }) {
				if (user?.id) {
					const claims = await openSession(user.id);
					return claims ? { ...token, ...claims } : null;
				}
				const claims = { sid: token.sid, gen: token.gen };
				if (!token.sub || !(await sessionValid(token.sub, claims))) return null;
				return token;
			},
			async session({ session, token }) {
				if (token.sub) session.user.id = token.sub;
				return session;
			}
		},
		events: {
			async signOut(message) {
				const token = 'token' in message ? message.token : null;
				if (!token) return;
				const exp = typeof token.exp === 'number' ? token.exp * 1000 : Date.now();
				await endSession(token.sid, new Date(Math.max(exp, Date.now() + SESSION_MAX_AGE_S * 1000)));
			}
		},
		logger: {
			error(error) {
				// A wrong password, a spent link or a suspended account is the visitor's news, not a fault.
				if (error instanceof CredentialsSignin || QUIET.has(error.name)) return;
				console.error('[auth]', error);
			},
			warn(code) {
				// AUTH_URL is set on purpose (links from ORIGIN only) beside the adapter's basePath.
				if (code === 'env-url-basepath-redundant') return;
				console.warn(`[auth] ${code}`);
			}
		}
	};
	return config;
}

export const { handle: authHandle, signIn, signOut } = SvelteKitAuth(async () => authConfig());
