/**
 * Browser benchmark of the campaign page and its editor, in headless Chromium:
 * - time until the matrix table is interactive and the time of one sort by speed, on the demo
 *   campaign with the largest matrix, each beside the same figures for a campaign with a trivial
 *   matrix measured in the same run;
 * - in the editor of the large campaign, the time from entering ", 42" at the end of the speeds
 *   field to figures that show a row for 42 m/s;
 * - the gzipped size of the JavaScript the campaign page loads.
 * Every figure is the median and range of `BENCH_RUNS` (at least 5) fresh pages, since these
 * machines are shared and single samples wander.
 */
import { gzipSync } from 'node:zlib';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { startSeededApp } from './app-server';
import { launchChromium, signInAsDemo } from './chromium';

const RUNS = Math.max(5, Number(process.env.BENCH_RUNS ?? 5));
const LARGE = 'AM-7 rear-wing wake survey';
// The floor: the same campaign page, same code and same panels, with a matrix of a few hundred
// points. What the page costs at 54 000 points beyond this is the matrix's own cost, so the
// ratio says how far the table still grows with its rows; an empty page of the app would hide
// the hydration and panels every campaign pays for anyway.
const TRIVIAL = 'AM-3 speed sweep';
const NEW_SPEED_MPS = 42;

type Figure = { median: number; min: number; max: number };

function summary(samples: number[]): Figure {
	const sorted = [...samples].sort((a, b) => a - b);
	const middle = sorted.length >> 1;
	const median = sorted.length % 2 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
	return { median, min: sorted[0]!, max: sorted.at(-1)! };
}

const ms = (f: Figure) => `${f.median.toFixed(0)} ms (${f.min.toFixed(0)}–${f.max.toFixed(0)})`;

/** A new context with the signed-in cookies and an empty cache, so each run loads cold. */
async function freshPage(browser: Browser, signedIn: BrowserContext): Promise<Page> {
	const context = await browser.newContext({
		viewport: { width: 1440, height: 1000 },
		storageState: await signedIn.storageState()
	});
	return context.newPage();
}

/**
 * Opens a campaign page and returns, on the page's own clock from navigation start, when the
 * matrix table had rows in the DOM and its sort buttons (rendered by the same mount) were live.
 */
async function timeToInteractive(
	page: Page,
	url: string
): Promise<{ interactive_ms: number; firstByte_ms: number }> {
	await page.goto(url, { waitUntil: 'commit' });
	const ready = await page.waitForFunction(
		() => {
			const table = document.querySelector('table[aria-rowcount]');
			const rows = table?.querySelectorAll('tbody tr[aria-rowindex]').length ?? 0;
			const sortable = table?.querySelector('thead button');
			return rows > 5 && sortable ? performance.now() : false;
		},
		undefined,
		{ polling: 'raf', timeout: 60_000 }
	);
	const firstByte_ms = await page.evaluate(
		() =>
			(performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming).responseStart
	);
	return { interactive_ms: (await ready.jsonValue()) as number, firstByte_ms };
}

/** Clicks the speed header in the page and waits for the frame that shows the sorted rows. */
function timeSortBySpeed(page: Page): Promise<number> {
	return page.evaluate(async () => {
		const button = [...document.querySelectorAll<HTMLButtonElement>('thead button')].find((b) =>
			b.textContent?.trim().startsWith('Speed')
		);
		if (!button) throw new Error('No speed header');
		const start = performance.now();
		button.click();
		await new Promise((resolve) => requestAnimationFrame(() => setTimeout(resolve)));
		const end = performance.now();
		if (!document.querySelector('th[aria-sort="ascending"]')) throw new Error('Not sorted');
		return end - start;
	});
}

async function campaignUrls(page: Page, baseUrl: string) {
	const href = async (name: string) =>
		`${baseUrl}${await page.getByRole('link', { name, exact: true }).getAttribute('href')}`;
	return { large: await href(LARGE), trivial: await href(TRIVIAL) };
}

/** The campaign page's scripts, gzipped, in bytes by address. */
function countScripts(page: Page): Map<string, number> {
	const scripts = new Map<string, number>();
	page.on('response', async (response) => {
		if (response.request().resourceType() !== 'script') return;
		const body = await response.body().catch(() => null);
		if (body) scripts.set(response.url(), gzipSync(body).byteLength);
	});
	return scripts;
}

/** The editor is for drafts: the seeded campaign waits in review, so its owner withdraws it. */
async function editorUrl(page: Page, campaignUrl: string): Promise<string> {
	await page.goto(campaignUrl);
	const withdraw = page.getByRole('button', { name: 'Withdraw from review' });
	if (await withdraw.count()) {
		await withdraw.click();
		await page.waitForLoadState('networkidle');
	}
	const edit = page.getByRole('link', { name: 'Edit draft' });
	await edit.waitFor();
	return new URL((await edit.getAttribute('href'))!, campaignUrl).href;
}

/**
 * Puts ", 42" at the end of the speeds and times that input to figures showing 42 m/s. The text
 * goes in as one input event, as a paste would: typed key by key, the field rewrites itself from
 * the parsed list after the comma and the separator is lost.
 */
async function timeEditorFigures(page: Page, url: string): Promise<number> {
	await page.goto(url);
	await page.waitForLoadState('networkidle');
	const figures = 'section[aria-labelledby="live-figures-title"]';
	await page.locator(`${figures}[aria-busy="false"]`).waitFor();
	const speeds = page.getByLabel('Tunnel speeds (comma-separated)');
	await speeds.focus();
	await speeds.press('End');
	await page.evaluate(() => {
		const marks = window as unknown as { lastInput_ms?: number };
		document.addEventListener('input', () => (marks.lastInput_ms = performance.now()), {
			capture: true
		});
	});
	await page.keyboard.insertText(`, ${NEW_SPEED_MPS}`);
	const done = await page.waitForFunction(
		({ selector, speed }) => {
			const section = document.querySelector(selector);
			if (section?.getAttribute('aria-busy') !== 'false') return false;
			const rows = [...section.querySelectorAll('tr')];
			const shown = rows.some(
				(row) =>
					Number(row.getAttribute('data-speed')) === speed ||
					Number.parseFloat(row.cells[0]?.textContent ?? '') === speed
			);
			const { lastInput_ms } = window as unknown as { lastInput_ms?: number };
			return shown && lastInput_ms !== undefined ? performance.now() - lastInput_ms : false;
		},
		{ selector: figures, speed: NEW_SPEED_MPS },
		{ polling: 'raf', timeout: 60_000 }
	);
	return (await done.jsonValue()) as number;
}

const app = await startSeededApp({ quiet: true });
const browser = await launchChromium();
try {
	const signedIn = await browser.newContext();
	const home = await signedIn.newPage();
	await signInAsDemo(home, app.baseUrl, 'aero@demo.test');
	const urls = await campaignUrls(home, app.baseUrl);

	const samples = { large: [] as number[], trivial: [] as number[] };
	const firstBytes = { large: [] as number[], trivial: [] as number[] };
	const sorts = { large: [] as number[], trivial: [] as number[] };
	let rowCount = 0;
	let scripts = new Map<string, number>();
	// Alternating the two pages spreads the machine's slow spells over both.
	for (let run = 0; run < RUNS; run++) {
		for (const which of ['large', 'trivial'] as const) {
			const page = await freshPage(browser, signedIn);
			const counted = run === 0 && which === 'large' ? countScripts(page) : null;
			const opened = await timeToInteractive(page, urls[which]);
			samples[which].push(opened.interactive_ms);
			firstBytes[which].push(opened.firstByte_ms);
			sorts[which].push(await timeSortBySpeed(page));
			if (counted) {
				await page.waitForLoadState('networkidle');
				scripts = counted;
				// aria-rowcount counts the header row too.
				rowCount = Number(await page.locator('[aria-rowcount]').getAttribute('aria-rowcount')) - 1;
			}
			await page.context().close();
		}
	}

	const interactive = summary(samples.large);
	const interactiveFloor = summary(samples.trivial);
	const sort = summary(sorts.large);
	const sortFloor = summary(sorts.trivial);
	const js_kB = [...scripts.values()].reduce((a, b) => a + b, 0) / 1024;
	console.log(`matrix rows: ${rowCount.toLocaleString('en-GB')}; ${RUNS} runs, median (min–max)`);
	console.log(
		`time to interactive table: ${ms(interactive)} (aim < 1000 ms); ` +
			`trivial matrix ${ms(interactiveFloor)}; ratio ${(interactive.median / interactiveFloor.median).toFixed(2)}`
	);
	console.log(
		`  of which the server's first byte: ${ms(summary(firstBytes.large))}; ` +
			`trivial matrix ${ms(summary(firstBytes.trivial))}`
	);
	console.log(
		`sort by speed: ${ms(sort)} (aim < 100 ms); ` +
			`trivial matrix ${ms(sortFloor)}; ratio ${(sort.median / sortFloor.median).toFixed(2)}`
	);
	console.log(
		`JavaScript loaded, gzipped: ${js_kB.toFixed(1)} kB in ${scripts.size} files (aim < 150 kB)`
	);
	const edits: number[] = [];
	const editUrl = await editorUrl(home, urls.large);
	for (let run = 0; run < RUNS; run++) {
		const page = await freshPage(browser, signedIn);
		edits.push(await timeEditorFigures(page, editUrl));
		await page.context().close();
	}

	console.log(`editor, input to figures for ${NEW_SPEED_MPS} m/s: ${ms(summary(edits))}`);
} finally {
	await browser.close();
	await app.stop();
}
