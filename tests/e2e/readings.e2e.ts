import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_READINGS } from '../../scripts/demo-scenario';
import { launchBrowser, ownOrigin, signedInPage, url } from './browser';

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

const as = (email: string) => signedInPage(browser, email);

/** Fills the template's rows of one run with readings, as the demo's wake would give them. */
function fillRun(template: string, run: number): string {
	const [header, ...rows] = template.trim().split('\n');
	const columns = header!.split(',');
	const at = (name: string) => columns.indexOf(name);
	const filled = rows.map((line) => {
		const cells = line.split(',');
		if (Number(cells[at('run')]) !== run) return line;
		const column = Number(cells[at('column')]);
		cells[at('reading')] = (-0.2 - 0.05 * Math.abs(column - 7)).toFixed(2);
		cells[at('unit')] = 'mmH2O';
		cells[at('reference_dynamic_pressure')] = '21.9';
		cells[at('air_temperature_c')] = String(DEMO_READINGS.airTemperature_C);
		cells[at('barometric_pressure')] = String(DEMO_READINGS.barometricPressure_hPa);
		cells[at('relative_humidity')] = String(DEMO_READINGS.relativeHumidity);
		return cells.join(',');
	});
	return [header, ...filled].join('\n') + '\n';
}

describe('readings', () => {
	it('downloads the template, uploads it filled in, and shows the coverage grow', async () => {
		const owner = await as('aero2@demo.test');
		const campaigns = await (await owner.context().request.get(url('/api/v1/campaigns'))).json();
		const campaignId = campaigns.campaigns.find(
			(c: { name: string }) => c.name === DEMO_READINGS.campaign
		).id;
		await owner.goto(url(`/campaigns/${campaignId}`));
		const coverage = owner.getByTestId('readings-coverage');
		// The seed sent static and total readings at every probe of four runs of 140 points.
		expect(await coverage.textContent()).toMatch(/560\s+of\s+1,680\s+planned points/);

		const [download] = await Promise.all([
			owner.waitForEvent('download'),
			owner.getByRole('link', { name: 'Template CSV' }).click()
		]);
		const template = readFileSync((await download.path())!, 'utf8');
		expect(template.trim().split('\n')).toHaveLength(1681);

		const file = join(mkdtempSync(join(tmpdir(), 'tunnelwright-e2e-')), 'run-1.csv');
		writeFileSync(file, fillRun(template, 1));
		await owner.getByLabel(/Readings file/).setInputFiles(file);
		await owner.getByRole('button', { name: 'Upload readings' }).click();
		await owner.getByText('Stored 140 readings in 1 run(s).').waitFor();
		await expect
			.poll(async () => await coverage.textContent())
			.toMatch(/700\s+of\s+1,680\s+planned points/);

		// The same file again is refused until the user says to replace what is stored.
		await owner.getByLabel(/Readings file/).setInputFiles(file);
		await owner.getByRole('button', { name: 'Upload readings' }).click();
		await owner.getByRole('button', { name: 'Replace them' }).click();
		await owner.getByText('Stored 140 readings in 1 run(s), replacing 140.').waitFor();

		// A file with a wrong unit is refused with the row and column named.
		writeFileSync(file, fillRun(template, 5).replaceAll('mmH2O', 'cmH2O'));
		await owner.getByLabel(/Readings file/).setInputFiles(file);
		await owner.getByRole('button', { name: 'Upload readings' }).click();
		const problems = owner.getByTestId('readings-problems');
		await problems.waitFor();
		expect(await problems.locator('tbody tr').first().textContent()).toMatch(/unit.*cmH2O/);
	});

	it('takes the same file from the acquisition computer with a personal API token', async () => {
		const operator = await as('operator@demo.test');
		const request = operator.context().request;
		const campaigns = await (await request.get(url('/api/v1/campaigns'))).json();
		const campaignId = campaigns.campaigns.find(
			(c: { name: string }) => c.name === DEMO_READINGS.campaign
		).id;
		const created = await request.post(url('/api/v1/tokens'), {
			headers: ownOrigin(),
			data: { name: 'Plover scanner PC', scopes: ['readings:write', 'readings:read'] }
		});
		expect(created.status()).toBe(201);
		const { token } = await created.json();

		const template = await (
			await request.get(url(`/campaigns/${campaignId}/readings/template.csv`))
		).text();
		const sent = await fetch(url(`/api/v1/campaigns/${campaignId}/readings`), {
			method: 'POST',
			headers: { authorization: `Bearer ${token}`, 'content-type': 'text/csv' },
			body: fillRun(template, 4)
		});
		expect(sent.status).toBe(201);
		expect((await sent.json()).upload).toMatchObject({ readingCount: 140, runCount: 1 });

		const read = await fetch(url(`/api/v1/campaigns/${campaignId}/readings?limit=1`), {
			headers: { authorization: `Bearer ${token}` }
		});
		expect(read.status).toBe(200);
		expect((await read.json()).coverage.runs.missing).toBeLessThan(8);

		const revoked = await request.delete(url(`/api/v1/tokens/${(await created.json()).id}`), {
			headers: ownOrigin()
		});
		expect(revoked.status()).toBe(204);
		const refused = await fetch(url(`/api/v1/campaigns/${campaignId}/readings`), {
			headers: { authorization: `Bearer ${token}` }
		});
		expect(refused.status).toBe(401);
	});
});
