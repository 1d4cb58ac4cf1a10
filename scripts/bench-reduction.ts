/**
 * Benchmark of the reduction: 100 000 static readings of a 108 000-point campaign (three
 * configurations, so every variant traverse is differenced against the baseline), reduced to
 * Cp, plane, row and column averages with uncertainties, differences, trends and sweeps, five
 * times; against a plain loop over the same readings that computes only the arithmetic means,
 * in the same run. Then the demo campaign's results page in headless Chromium, five loads: the
 * time until its first colour map can take keyboard focus.
 */
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { receiveReadings } from '../src/lib/server/readings';
import { reductionInput } from '../src/lib/server/results';
import { reduceCampaign, type ReadingColumns } from '../src/lib/results/reduce';
import { openObjectStore } from '../src/lib/server/storage/open';
import { startSeededApp } from './app-server';
import { approvedWorld, freshDb } from './bench-world';
import { launchChromium, signInAsDemo } from './chromium';
import { DEMO_READINGS } from './demo-scenario';
import type { RunLayout } from '../src/lib/calc';

const READINGS = 100_000;
const REPEATS = 5;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const fmt = (xs: number[], unit = 'ms', digits = 1) =>
	`${median(xs).toFixed(digits)} ${unit} (${Math.min(...xs).toFixed(digits)}–${Math.max(...xs).toFixed(digits)})`;

/** Plane, row and column means of the raw readings of each run: the arithmetic alone. */
function plainMeans(layout: RunLayout, r: ReadingColumns): number {
	let checksum = 0;
	let k = 0;
	for (const run of layout.runs) {
		const rows = new Float64Array(run.rows);
		const rowN = new Float64Array(run.rows);
		const columns = new Float64Array(run.columns);
		const columnN = new Float64Array(run.columns);
		let sum = 0;
		let n = 0;
		const last = run.firstPoint + run.rows * run.columns;
		for (; k < r.point.length && r.point[k]! < last; k++) {
			const offset = r.point[k]! - run.firstPoint;
			const i = Math.floor(offset / run.columns);
			const j = offset % run.columns;
			const v = r.pressure_Pa[k]!;
			rows[i]! += v;
			rowN[i]!++;
			columns[j]! += v;
			columnN[j]!++;
			sum += v;
			n++;
		}
		if (n) checksum += sum / n;
		for (let i = 0; i < run.rows; i++) if (rowN[i]) checksum += rows[i]! / rowN[i]!;
		for (let j = 0; j < run.columns; j++) if (columnN[j]) checksum += columns[j]! / columnN[j]!;
	}
	return checksum;
}

const { db, dir } = freshDb();
const w = approvedWorld(db);
const lines = [
	'point,kind,reading,unit,reference_dynamic_pressure,reference_unit,air_temperature_C,barometric_pressure,barometric_unit,relative_humidity'
];
for (let point = 1; point <= READINGS; point++)
	lines.push(
		`${point},static,${(-2 + Math.sin(point / 37)).toFixed(3)},mmH2O,612.4,Pa,19.5,1002.1,hPa,0.51`
	);
const files = await openObjectStore({ LOCAL_S3_DIR: join(dir, 'objects') }, () => {});
const stored = await receiveReadings(db, files.store, w.aero, w.campaignId, {
	fileName: 'bench.csv',
	mediaType: 'text/csv',
	bytes: new TextEncoder().encode(lines.join('\n')),
	channel: 'api'
});
await files.close();
if (!stored.ok) throw new Error(stored.message);

const read_ms: number[] = [];
const reduce_ms: number[] = [];
const floor_ms: number[] = [];
let runs = 0;
for (let i = 0; i < REPEATS; i++) {
	const t0 = performance.now();
	const read = reductionInput(db, w.aero, w.campaignId);
	const t1 = performance.now();
	if (!read.ok) throw new Error(read.message);
	const results = reduceCampaign(read.input);
	const t2 = performance.now();
	plainMeans(read.input.layout, read.input.readings);
	const t3 = performance.now();
	read_ms.push(t1 - t0);
	reduce_ms.push(t2 - t1);
	floor_ms.push(t3 - t2);
	runs = results.runs.length;
}
db.$client.close();
rmSync(dir, { recursive: true, force: true });

console.log(
	`Reduction: ${READINGS.toLocaleString('en-GB')} readings in ${runs} traverses, ${REPEATS} runs (median, min–max)`
);
console.log(`  read from the database   ${fmt(read_ms)}`);
console.log(`  reduce                   ${fmt(reduce_ms)}`);
console.log(`  plain means (floor)      ${fmt(floor_ms, 'ms', 2)}`);
console.log(
	`  ratio reduce / floor     ${fmt(
		reduce_ms.map((t, i) => t / floor_ms[i]!),
		'×'
	)}   (aim ≤ 3)`
);

const app = await startSeededApp({ quiet: true });
const browser = await launchChromium();
try {
	const context = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
	const page = await context.newPage();
	await signInAsDemo(page, app.baseUrl, 'aero2@demo.test');
	const listing = await (
		await page.context().request.get(`${app.baseUrl}/api/v1/campaigns`)
	).json();
	const id = listing.campaigns.find((c: { name: string }) => c.name === DEMO_READINGS.campaign).id;
	const interactive_ms: number[] = [];
	for (let i = 0; i < REPEATS; i++) {
		const fresh = await context.newPage();
		const opened = performance.now();
		await fresh.goto(`${app.baseUrl}/campaigns/${id}/results`);
		const cell = fresh.locator('[data-testid="results-map"] [tabindex="0"]').first();
		await cell.focus();
		interactive_ms.push(performance.now() - opened);
		await fresh.close();
	}
	console.log(
		`  demo results page, time to a focusable map cell   ${fmt(interactive_ms, 'ms', 0)}   (aim < 1 000 ms)`
	);
} finally {
	await browser.close();
	await app.stop();
}
