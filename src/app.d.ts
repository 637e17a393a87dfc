import type { CurrentUser } from '$lib/server/auth/current-user';

declare global {
	namespace App {
		interface Locals {
			/** The signed-in member, loaded fresh from the database on every request. */
			user: CurrentUser | null;
			/** Markup put into the page's HTML after rendering (web/html-slots.ts), kept out of its data. */
			htmlSlots?: Record<string, string>;
			/** The locale this request's numbers and dates are written in (web/locale.ts). */
			locale?: string;
		}
		interface Error {
			message: string;
			/** API routes repeat the message here, with field problems in `issues`. */
			error?: string;
			issues?: { path: string; message: string }[];
		}
	}
}

export {};
