import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signIn, url } from './browser';

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

const NEWCOMER = {
	name: 'Rafaela Quist',
	email: 'rafaela.quist@demo.test',
	password: 'a-long-newcomer-secret'
};

describe('an account from invitation to deactivation', () => {
	it('is invited by the admin, sets a password, signs in, and is refused once deactivated', async () => {
		const admin = await browser.newContext();
		const adminPage = await admin.newPage();
		await signIn(adminPage, 'admin@demo.test');
		await adminPage.waitForURL(url('/admin'));

		await adminPage.getByLabel('Name').fill(NEWCOMER.name);
		await adminPage.getByLabel('E-mail').fill(NEWCOMER.email);
		await adminPage.getByLabel('Tunnel operator').first().check();
		await adminPage.getByLabel('Kestrel Ridge Aero Laboratory').check();
		await adminPage.getByRole('button', { name: 'Create invitation' }).click();
		const linkField = adminPage.getByTestId('invitation-link');
		await linkField.waitFor();
		const link = await linkField.inputValue();
		expect(link).toMatch(/\/invitation\/[\w-]{40,}$/);

		const newcomer = await browser.newContext();
		const page = await newcomer.newPage();
		await page.goto(link);
		await page.getByLabel('New password').fill(NEWCOMER.password);
		await page.getByLabel('Repeat it').fill(NEWCOMER.password);
		await page.getByRole('button', { name: 'Set password and sign in' }).click();
		await page.waitForURL(url('/operations'));

		// The link works once only.
		const again = await browser.newPage();
		await again.goto(link);
		await again.getByText('This link no longer works').waitFor();
		await again.close();

		await adminPage.reload();
		const row = adminPage.getByTestId(`person-${NEWCOMER.email}`);
		await row.getByRole('button', { name: 'Deactivate' }).click();
		await adminPage.getByText('Account deactivated; its sessions ended.').waitFor();

		// The open session ends at once.
		await page.goto(url('/operations'));
		await page.waitForURL(/\/signin/);
		await signIn(page, NEWCOMER.email, NEWCOMER.password);
		const alert = page.getByRole('alert');
		await alert.waitFor();
		expect(await alert.textContent()).toContain('deactivated');
		expect(page.url()).toContain('/signin');

		await admin.close();
		await newcomer.close();
	});

	it('keeps other roles off the admin page, on the server', async () => {
		const context = await browser.newContext();
		const page = await context.newPage();
		await signIn(page, 'reviewer@demo.test');
		await page.waitForURL(url('/review'));
		const response = await page.goto(url('/admin'));
		expect(response?.status()).toBe(403);
		const posted = await context.request.post(url('/admin?/deactivate'), {
			form: { userId: 'anyone' },
			headers: { origin: new URL(url('/')).origin }
		});
		expect(posted.status()).toBe(403);
		await context.close();
	});
});
