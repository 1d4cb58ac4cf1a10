import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_READINGS } from '../../scripts/demo-scenario';
import { launchBrowser, signedInPage, url } from './browser';

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

const as = (email: string) => signedInPage(browser, email);

async function demoCampaignId(page: Page): Promise<string> {
	const listing = await (await page.context().request.get(url('/api/v1/campaigns'))).json();
	return listing.campaigns.find((c: { name: string }) => c.name === DEMO_READINGS.campaign).id;
}

describe('results', () => {
	it('shows the demo campaign’s colour maps and plane-average plot, and exports a row per point', async () => {
		const owner = await as('aero2@demo.test');
		const id = await demoCampaignId(owner);
		await owner.goto(url(`/campaigns/${id}`));
		await owner.getByRole('link', { name: 'Results' }).click();
		await owner.waitForURL(`**/campaigns/${id}/results**`);
		const map = owner.getByTestId('results-map').first();
		await map.waitFor();
		const cell = map.locator('[tabindex="0"]').first();
		await cell.focus();
		expect(await cell.getAttribute('aria-label')).toMatch(/Cp/);
		await owner.getByTestId('distance-plot').first().waitFor();

		const csv = await (
			await owner.context().request.get(url(`/campaigns/${id}/results.csv`))
		).text();
		const levels = csv
			.trim()
			.split('\n')
			.slice(1)
			.map((line) => line.split(',')[0]);
		// Every traverse of the 10 × 14 plane that has readings: the seed's four, and any that other
		// tests sent before this one.
		const runs = (
			await (await owner.context().request.get(url(`/api/v1/campaigns/${id}/results`))).json()
		).runs;
		expect(runs.length).toBeGreaterThanOrEqual(4);
		expect(levels.filter((l) => l === 'plane')).toHaveLength(runs.length);
		expect(levels.filter((l) => l === 'point')).toHaveLength(140 * runs.length);
	});

	it('lets a reviewer read the results and keeps another team out', async () => {
		const reviewer = await as('reviewer@demo.test');
		const id = await demoCampaignId(reviewer);
		const answer = await reviewer.context().request.get(url(`/api/v1/campaigns/${id}/results`));
		expect(answer.status()).toBe(200);
		const body = await answer.json();
		expect(body.runs.length).toBeGreaterThanOrEqual(4);
		expect(
			body.runs.find((r: { configurationId: string }) => r.configurationId === 'nose-down')
				.difference
		).not.toBeNull();

		const other = await as('aero@demo.test');
		expect(
			(await other.context().request.get(url(`/api/v1/campaigns/${id}/results`))).status()
		).toBe(404);
		expect((await other.goto(url(`/campaigns/${id}/results`)))?.status()).toBe(404);
	});
});
