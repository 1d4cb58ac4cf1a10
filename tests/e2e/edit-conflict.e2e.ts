/**
 * One person edits the same model in two windows (two team-mates would alike): the second save is not lost
 * silently. The form says who saved what in between, and the user chooses.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signedInPage, url } from './browser';

let browser: Browser;
let closeBrowser: () => Promise<void>;

beforeAll(async () => {
	({ browser, close: closeBrowser } = await launchBrowser());
});
afterAll(async () => closeBrowser?.());

async function editPage(page: Page, modelId: string) {
	await page.goto(url(`/models/${modelId}/edit`));
	await page.waitForLoadState('networkidle');
	return page;
}

async function storedModel(page: Page, modelId: string) {
	const answer = await page.request.get(url(`/api/v1/models/${modelId}`));
	return (await answer.json()).model as { name: string; fullScaleLength_m: number };
}

describe('a model edited in two windows at once', () => {
	it('shows who changed what when the second window saves, and keeps its values only when asked', async () => {
		const first = await signedInPage(browser, 'aero@demo.test');
		const second = await signedInPage(browser, 'aero@demo.test');
		const listed = await first.request.get(url('/api/v1/models'));
		const model = ((await listed.json()).models as { id: string; name: string }[])[0]!;
		const original = await storedModel(first, model.id);

		await editPage(first, model.id);
		await editPage(second, model.id);

		await first.getByLabel('Name', { exact: true }).fill(`${original.name} (revised)`);
		await first.getByRole('button', { name: 'Save model' }).click();
		await first.waitForURL(url(`/models/${model.id}`));

		const longer = String(original.fullScaleLength_m + 0.1);
		await second.getByLabel('Length', { exact: true }).fill(longer);
		await second.getByRole('button', { name: 'Save model' }).click();
		const notice = second.getByRole('alert').filter({ hasText: 'after you opened this page' });
		await notice.waitFor();
		expect(await notice.textContent()).toMatch(/Saved by Imogen Vale/);
		const nameRow = notice.getByRole('row', { name: /^Name/ });
		expect(await nameRow.textContent()).toContain(`${original.name} (revised)`);
		// Nothing was written by the refused save.
		expect(await storedModel(second, model.id)).toMatchObject({
			name: `${original.name} (revised)`,
			fullScaleLength_m: original.fullScaleLength_m
		});

		await notice.getByRole('button', { name: 'Save my values over it' }).click();
		await second.waitForURL(url(`/models/${model.id}`));
		expect(await storedModel(second, model.id)).toMatchObject({
			name: original.name,
			fullScaleLength_m: Number(longer)
		});

		// The first window's form is now stale; it can drop its edits and load what is saved.
		await editPage(first, model.id);
		await editPage(second, model.id);
		await second.getByLabel('Name', { exact: true }).fill('Saved from the second window');
		await second.getByRole('button', { name: 'Save model' }).click();
		await second.waitForURL(url(`/models/${model.id}`));
		await first.getByLabel('Name', { exact: true }).fill('Lost on purpose');
		await first.getByRole('button', { name: 'Save model' }).click();
		const again = first.getByRole('alert').filter({ hasText: 'after you opened this page' });
		await again.waitFor();
		await Promise.all([
			first.waitForEvent('load'),
			again.getByRole('button', { name: 'Discard my edits and load the saved version' }).click()
		]);
		await first.waitForLoadState('networkidle');
		expect(await first.getByLabel('Name', { exact: true }).inputValue()).toBe(
			'Saved from the second window'
		);
		await first.context().close();
		await second.context().close();
	});
});
