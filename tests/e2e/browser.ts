import type { Browser, BrowserContextOptions, Page } from 'playwright-core';
import { inject } from 'vitest';
import { launchChromium } from '../../scripts/chromium';
import { DEMO_PASSWORD } from '../../scripts/demo-scenario';
import { postCredentials as postCredentialsTo, signInCookie } from './http-session';

export async function launchBrowser(): Promise<{ browser: Browser; close: () => Promise<void> }> {
	const browser = await launchChromium();
	return { browser, close: () => browser.close() };
}

export function url(path: string): string {
	return new URL(path, inject('baseUrl')).toString();
}

/** The Origin header a page of the app sends with its writes; cookie writes need it. */
export function ownOrigin(): { origin: string } {
	return { origin: new URL(url('/')).origin };
}

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
	await page.goto(url('/signin'));
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill(password);
	await page.getByRole('button', { name: 'Sign in' }).click();
}

/** A fresh browser context signed in as `email`, on the page sign-in lands on. */
export async function signedInPage(
	browser: Browser,
	email: string,
	options: BrowserContextOptions = {}
): Promise<Page> {
	const page = await (await browser.newContext({ acceptDownloads: true, ...options })).newPage();
	await signIn(page, email);
	await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
	return page;
}

/** Posts credentials straight to Auth.js, as a script without a browser does. */
export function postCredentials(email: string, password = DEMO_PASSWORD): Promise<Response> {
	return postCredentialsTo(inject('baseUrl'), email, password);
}

/** A session cookie for `email`. */
export function sessionCookie(email: string, password = DEMO_PASSWORD): Promise<string> {
	return signInCookie(inject('baseUrl'), email, password);
}
