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
