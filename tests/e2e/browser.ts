import { chromium, type Browser, type Page } from 'playwright-core';
import { inject } from 'vitest';
import { DEMO_PASSWORD } from '../../scripts/demo-scenario';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

// Debian's Chromium, headless; the background-networking flags stop it calling hosts this
// network refuses.
const FLAGS = [
	'--headless',
	'--no-sandbox',
	'--disable-gpu',
	'--disable-quic',
	'--no-first-run',
	'--disable-background-networking',
	'--disable-component-update',
	'--disable-sync'
];

/** Playwright gives each launch a fresh temporary profile of its own. */
export async function launchBrowser(): Promise<{ browser: Browser; close: () => Promise<void> }> {
	const browser = await chromium.launch({ executablePath: CHROMIUM, args: FLAGS });
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
