import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../scripts/demo-scenario';
import { homePath } from '../../src/lib/roles';
import { launchBrowser, ownOrigin, signIn, url } from './browser';

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

describe('signing in', () => {
	it.each(DEMO_ACCOUNTS)('$email lands on the home page of its role', async (account) => {
		const context = await browser.newContext();
		const page = await context.newPage();
		await signIn(page, account.email);
		await page.waitForURL(url(homePath(account.roles)));
		expect(await page.getByTestId('signed-in-user').textContent()).toContain(account.name);
		await expect
			.poll(() => page.getByRole('note').textContent())
			.toContain('Planning estimates only');

		await page.getByRole('button', { name: 'Sign out', exact: true }).click();
		await page.waitForURL(/\/signin/);
		await page.goto(url(homePath(account.roles)));
		await page.waitForURL(/\/signin\?redirectTo=/);
		await context.close();
	});

	it('gives one clear message for a wrong password and keeps the e-mail', async () => {
		const page = await browser.newPage();
		await signIn(page, 'reviewer@demo.test', 'not-the-demo-password');
		const alert = page.getByRole('alert');
		await alert.waitFor();
		expect(await alert.textContent()).toContain(
			'That e-mail and password do not match an account.'
		);
		expect(await page.getByLabel('E-mail').inputValue()).toBe('reviewer@demo.test');
		expect(await page.getByLabel('Password').inputValue()).toBe('');
		await page.close();
	});

	it('shows field messages for a malformed e-mail and a short password', async () => {
		const page = await browser.newPage();
		await signIn(page, 'not-an-address', 'short');
		await page.getByText('Enter an e-mail address').waitFor();
		await page.getByText('Use at least 12 characters.').waitFor();
		expect(page.url()).toContain('/signin');
		await page.close();
	});

	it('returns to the page asked for after signing in', async () => {
		const page = await browser.newPage();
		await page.goto(url('/facilities'));
		await page.waitForURL(/redirectTo=%2Ffacilities/);
		await page.getByLabel('E-mail').fill('operator@demo.test');
		await page.getByLabel('Password').fill(DEMO_PASSWORD);
		await page.getByRole('button', { name: 'Sign in' }).click();
		await page.waitForURL(url('/facilities'));
		expect(await page.getByRole('cell', { name: 'Tern closed-return tunnel' }).count()).toBe(1);
		await page.close();
	});
});

describe('the API', () => {
	it('answers 401 JSON to a signed-out GET /api/v1/me', async () => {
		const response = await fetch(url('/api/v1/me'));
		expect(response.status).toBe(401);
		expect(await response.json()).toEqual({
			error: { code: 'unauthenticated', message: 'Sign in to continue.' }
		});
	});

	it('answers with the user and roles once signed in', async () => {
		const context = await browser.newContext();
		const page = await context.newPage();
		await signIn(page, 'aero2@demo.test');
		await page.waitForURL(url('/campaigns'));
		const me = await context.request.get(url('/api/v1/me'));
		expect(me.status()).toBe(200);
		expect(await me.json()).toMatchObject({
			user: { email: 'aero2@demo.test' },
			roles: ['aerodynamicist'],
			teams: [{ name: 'Brightwater Drone Works', kind: 'client' }]
		});
		await context.close();
	});

	it('computes for a signed-in user and refuses others with 401 JSON', async () => {
		const body = { model: 'isa', geopotentialAltitude: { value: 5, unit: 'km' } };
		const signedOut = await fetch(url('/api/v1/calc/atmosphere'), {
			method: 'POST',
			body: JSON.stringify(body),
			headers: { 'content-type': 'application/json' }
		});
		expect(signedOut.status).toBe(401);
		expect((await signedOut.json()).error.code).toBe('unauthenticated');

		const context = await browser.newContext();
		const page = await context.newPage();
		await signIn(page, 'aero@demo.test');
		await page.waitForURL(url('/campaigns'));
		const answer = await context.request.post(url('/api/v1/calc/atmosphere'), {
			data: body,
			headers: ownOrigin()
		});
		expect(answer.status()).toBe(200);
		// ISO 2533:1975 table 5 (from memory): H = 5000 m → 255.650 K, 0.736116 kg/m³.
		const { air } = await answer.json();
		expect(air.temperature_K).toBeCloseTo(255.65, 3);
		expect(air.density_kgm3).toBeCloseTo(0.736116, 5);
		await context.close();
	});

	it('answers unknown API paths with the JSON error shape', async () => {
		const response = await fetch(url('/api/v1/no-such-thing'));
		expect(response.status).toBe(404);
		expect((await response.json()).error.code).toBe('not-found');
	});
});

describe('oversized requests', () => {
	const body = 'x'.repeat(2 * 1024 * 1024);
	it.each(['/signin', '/api/v1/me'])('POST %s with a 2 MiB body answers 413', async (path) => {
		const response = await fetch(url(path), {
			method: 'POST',
			body,
			headers: {
				'content-type': 'application/x-www-form-urlencoded',
				origin: url('/').slice(0, -1)
			}
		});
		expect(response.status).toBe(413);
		// The API answers its JSON error; a page answers in words, which a form can show.
		if (path.startsWith('/api/')) expect((await response.json()).error.code).toBe('too-large');
		else expect(await response.text()).toMatch(/over 1\.0 MiB/);
	});
});
