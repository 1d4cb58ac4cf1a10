import type { Browser, Page } from 'playwright-core';
import { inject } from 'vitest';
import { launchChromium } from '../../scripts/chromium';
import { DEMO_PASSWORD } from '../../scripts/demo-scenario';

export async function launchBrowser(): Promise<{ browser: Browser; close: () => Promise<void> }> {
	const browser = await launchChromium();
	return { browser, close: () => browser.close() };
}

export function url(path: string): string {
	return new URL(path, inject('baseUrl')).toString();
}

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
	await page.goto(url('/signin'));
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill(password);
	await page.getByRole('button', { name: 'Sign in' }).click();
}

/** A fresh browser context signed in as `email`, on the page sign-in lands on. */
export async function signedInPage(browser: Browser, email: string): Promise<Page> {
	const page = await (await browser.newContext({ acceptDownloads: true })).newPage();
	await signIn(page, email);
	await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
	return page;
}
