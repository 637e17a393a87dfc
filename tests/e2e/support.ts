import { expect, type Page } from '@playwright/test';
import fs from 'node:fs';

export { makeUser } from '../support/factories';

type Demo = {
	passwords: Record<string, string>;
	people: { email: string; name: string; role: string }[];
};
const demo = JSON.parse(
	fs.readFileSync(new URL('../../scripts/demo/people.json', import.meta.url), 'utf8')
) as Demo;

/** The first seeded demo account with a role, and its password. */
export function demoAccount(role: 'member' | 'moderator' | 'shop' | 'admin') {
	const p = demo.people.find((x) => x.role === role)!;
	return { email: p.email, name: p.name, password: demo.passwords[role] };
}

/** Waits until the page is hydrated: typing earlier is lost when hydration resets the fields. */
export async function hydrated(page: Page) {
	await page.locator('html[data-hydrated]').waitFor({ state: 'attached' });
}

/** page.goto, then wait for hydration before the test types anything. */
export async function open(page: Page, url: string) {
	await page.goto(url);
	await hydrated(page);
}

export async function signInWithPassword(
	page: Page,
	email: string,
	password: string,
	next?: string,
	/** false in a context with JavaScript turned off: nothing hydrates there. */
	scripts = true
) {
	const url = next ? `/signin?next=${encodeURIComponent(next)}` : '/signin';
	if (scripts) await open(page, url);
	else await page.goto(url);
	const form = page.getByRole('form', { name: 'With your password' });
	await form.getByLabel('E-mail').fill(email);
	await form.getByLabel('Password').fill(password);
	await form.getByRole('button', { name: 'Sign in' }).click();
}

/** Opens the newest mail to `to` in the local outbox page (retrying while it is on its way). */
export async function openNewestMail(page: Page, to: string, subject: RegExp) {
	await expect(async () => {
		await page.goto(`/dev/outbox?to=${encodeURIComponent(to)}`);
		await expect(page.getByRole('link', { name: subject }).first()).toBeVisible({ timeout: 500 });
	}).toPass({ timeout: 10_000 });
	await page.getByRole('link', { name: subject }).first().click();
	await expect(page.getByRole('heading', { level: 1 })).toHaveText(subject);
}

/** The first link in the open mail that contains `part`. */
export async function linkInMail(page: Page, part: string): Promise<string> {
	const href = await page.getByRole('link').filter({ hasText: part }).first().getAttribute('href');
	expect(href).toBeTruthy();
	return href!;
}
