/**
 * Browser benchmark of the campaign page: opens the demo campaign with the largest matrix in
 * headless Chromium and prints the time until its matrix table is interactive, the time of one
 * sort, and the gzipped size of the JavaScript the page loaded. Figures vary between runs.
 */
import { gzipSync } from 'node:zlib';
import { startSeededApp } from './app-server';
import { launchChromium, signInAsDemo } from './chromium';

const app = await startSeededApp({ quiet: true });
const browser = await launchChromium();
try {
	const context = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
	const page = await context.newPage();
	await signInAsDemo(page, app.baseUrl, 'aero@demo.test');
	const link = page.getByRole('link', { name: 'AM-7 rear-wing wake survey' });
	const href = await link.getAttribute('href');

	// A fresh page so the JavaScript counted is what this page needs, cache empty.
	const fresh = await context.newPage();
	await fresh.route('**/*', (route) => route.continue());
	const scripts = new Map<string, number>();
	fresh.on('response', async (response) => {
		if (response.request().resourceType() !== 'script') return;
		const body = await response.body().catch(() => null);
		if (body) scripts.set(response.url(), gzipSync(body).byteLength);
	});
	const opened = performance.now();
	await fresh.goto(`${app.baseUrl}${href}`);
	const table = fresh.locator('[aria-rowcount]').first();
	await table.waitFor({ state: 'attached' });
	// aria-rowcount counts the header row too.
	const rowCount = Number(await table.getAttribute('aria-rowcount')) - 1;
	const speedHeader = fresh.getByRole('button', { name: /^Speed/ }).first();
	await speedHeader.waitFor();
	await fresh.waitForFunction(() => document.querySelectorAll('[aria-rowindex]').length > 5);
	const interactive_ms = performance.now() - opened;

	const sortStart = performance.now();
	await speedHeader.click();
	await fresh.locator('[aria-sort="ascending"], [aria-sort="descending"]').first().waitFor();
	await fresh.evaluate(
		() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)))
	);
	const sort_ms = performance.now() - sortStart;
	await fresh.waitForLoadState('networkidle');
	const js_kB = [...scripts.values()].reduce((a, b) => a + b, 0) / 1024;

	console.log(`matrix rows: ${rowCount.toLocaleString('en-GB')}`);
	console.log(`time to interactive table: ${interactive_ms.toFixed(0)} ms (aim < 1500 ms)`);
	console.log(`sort by speed: ${sort_ms.toFixed(0)} ms (aim < 200 ms)`);
	console.log(
		`JavaScript loaded, gzipped: ${js_kB.toFixed(1)} kB in ${scripts.size} files (aim < 150 kB)`
	);
} finally {
	await browser.close();
	await app.stop();
}
