import { chromium, type Browser, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from './demo-scenario';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

// Debian's Chromium, headless; the background-networking flags stop it calling hosts this
// network refuses. Playwright gives each launch a fresh temporary profile of its own.
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

export function launchChromium(): Promise<Browser> {
	return chromium.launch({ executablePath: CHROMIUM, args: FLAGS });
}

/** Signs a page in as a demo account on the app at `baseUrl` and waits to leave the sign-in page. */
export async function signInAsDemo(page: Page, baseUrl: string, email: string): Promise<void> {
	await page.goto(`${baseUrl}/signin`);
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill(DEMO_PASSWORD);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
}
