import { readFile } from 'node:fs/promises';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signIn, url } from './browser';

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

const speedRow = (page: Page, speed: number) =>
	page
		.locator(
			`[data-testid=live-speeds] tr[data-speed="${speed}"], [data-testid=speed-figures] tr[data-speed="${speed}"]`
		)
		.first();

describe('drafting a campaign from scratch', () => {
	it('creates a model and a campaign, follows live figures, flags a limit, and exports the matrix', async () => {
		const context = await browser.newContext({ acceptDownloads: true });
		const page = await context.newPage();
		await signIn(page, 'aero@demo.test');
		await page.waitForURL(url('/campaigns'));

		await page.goto(url('/models/new'));
		await page.waitForLoadState('networkidle');
		await page.getByLabel('Name', { exact: true }).fill('Kite-3 estate body');
		await page.getByLabel('Scale 1 : N', { exact: true }).fill('5');
		await page.getByLabel('Length', { exact: true }).fill('4.4');
		await page.getByLabel('Width', { exact: true }).fill('1.8');
		await page.getByLabel('Height', { exact: true }).fill('1.5');
		await page.getByLabel('Frontal area, full scale', { exact: true }).fill('2.3');
		await page.getByLabel('Reference length for Re (full scale)', { exact: true }).fill('4.4');
		await page.getByRole('button', { name: 'Add model' }).click();
		await page.waitForURL(/\/models\/[0-9a-f-]{36}$/);
		const modelId = page.url().split('/').at(-1)!;

		await page.goto(url(`/campaigns/new?model=${modelId}`));
		await page.waitForLoadState('networkidle');
		await page.getByLabel('Name', { exact: true }).fill('Kite-3 wake check');
		const speeds = page.getByLabel('Tunnel speeds (comma-separated)');
		await speeds.fill('20, 30');
		await speedRow(page, 30).waitFor();
		const re30 = await speedRow(page, 30).locator('[data-col=modelRe]').textContent();
		const q30 = await speedRow(page, 30).locator('[data-col=q]').textContent();
		const urlBefore = page.url();

		await speeds.fill('20, 32');
		await speedRow(page, 32).waitFor();
		expect(await speedRow(page, 32).locator('[data-col=modelRe]').textContent()).not.toBe(re30);
		expect(await speedRow(page, 32).locator('[data-col=q]').textContent()).not.toBe(q30);
		expect(page.url()).toBe(urlBefore);

		// The first facility by name is the open jet, whose envelope ends at 35 m/s.
		await speeds.fill('20, 40');
		const limit = page.locator('[data-code="speed-above-envelope"]');
		await limit.waitFor();
		expect(await limit.getAttribute('data-level')).toBe('limit');

		await page.getByRole('button', { name: 'Save draft' }).click();
		await page
			.locator('#campaign-form')
			.getByText(/40 m\/s is above/)
			.waitFor();
		await speeds.fill('20, 30');
		await page.getByRole('button', { name: 'Save draft' }).click();
		await page.waitForURL(/\/campaigns\/[0-9a-f-]{36}$/);
		const campaignUrl = page.url();
		await speedRow(page, 30).waitFor();

		const [download] = await Promise.all([
			page.waitForEvent('download'),
			page.getByRole('link', { name: 'Matrix as CSV' }).click()
		]);
		const csv = (await readFile((await download.path())!, 'utf8')).trim().split('\n');
		expect(csv[0]).toBe(
			'point,run,configuration,yaw_deg,speed_mps,plane,downstream_m,repeat,row,column,y_m,z_m,model_Re,q_Pa,q_mmH2O,Mach,q_corrected_Pa'
		);
		// One configuration × 2 speeds × 1 yaw × a 5 × 7 plane × 1 repeat, plus the header.
		expect(csv).toHaveLength(2 * 35 + 1);

		const other = await browser.newContext();
		const outsider = await other.newPage();
		await signIn(outsider, 'aero2@demo.test');
		await outsider.waitForURL(url('/campaigns'));
		expect((await outsider.goto(campaignUrl))?.status()).toBe(404);
		expect((await outsider.goto(url(`/models/${modelId}`)))?.status()).toBe(404);
		const api = await other.request.get(url(`/api/v1/campaigns/${campaignUrl.split('/').at(-1)}`));
		expect(api.status()).toBe(404);
		await other.close();
		await context.close();
	});
});
