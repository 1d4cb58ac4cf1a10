/**
 * Benchmark of readings intake: parses, checks and stores 100 000 readings of a 108 000-point
 * approved campaign, five times on fresh databases, and prints the median and range of each
 * phase, rows per second and memory growth. The floor, measured in the same run, is Papa Parse
 * reading the same bytes plus a bare insert of the same rows in one transaction: the work that
 * no intake can skip. The ratio says what checking and bookkeeping cost on top of it.
 */
import Papa from 'papaparse';
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { campaign, reading } from '../src/lib/server/db/schema';
import { approvedLayout, receiveReadings, type ReceivePhase } from '../src/lib/server/readings';
import { openObjectStore } from '../src/lib/server/storage/open';
import { approvedWorld, freshDb } from './bench-world';

const READINGS = 100_000;
const REPEATS = 5;

function readingsCsv(pointCount: number): Uint8Array {
	const lines = [
		'point,kind,reading,unit,reference_dynamic_pressure,reference_unit,air_temperature_C,barometric_pressure,barometric_unit,relative_humidity'
	];
	for (let point = 1; point <= pointCount; point++) {
		const value = (-2 + Math.sin(point / 37)).toFixed(3);
		lines.push(`${point},static,${value},mmH2O,612.4,Pa,19.5,1002.1,hPa,0.51`);
	}
	return new TextEncoder().encode(lines.join('\n') + '\n');
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const fmt = (xs: number[], unit = 'ms', digits = 0) =>
	`${median(xs).toFixed(digits)} ${unit} (${Math.min(...xs).toFixed(digits)}–${Math.max(...xs).toFixed(digits)})`;

const bytes = readingsCsv(READINGS);
const phases: Record<ReceivePhase | 'total' | 'floor', number[]> = {
	parse: [],
	check: [],
	store: [],
	total: [],
	floor: []
};
const rssGrowth_MB: number[] = [];
global.gc?.();
const heapBefore = process.memoryUsage().heapUsed;

for (let i = 0; i < REPEATS; i++) {
	const { db, dir } = freshDb();
	const w = approvedWorld(db);
	const files = await openObjectStore({ LOCAL_S3_DIR: join(dir, 'objects') }, () => {});
	global.gc?.();
	const rss0 = process.memoryUsage().rss;
	let rssPeak = rss0;
	const sampler = setInterval(() => (rssPeak = Math.max(rssPeak, process.memoryUsage().rss)), 10);
	const started: Partial<Record<ReceivePhase, number>> = {};
	const t0 = performance.now();
	const outcome = await receiveReadings(
		db,
		files.store,
		w.aero,
		w.campaignId,
		{ fileName: 'bench.csv', mediaType: 'text/csv', bytes, channel: 'api' },
		{
			progress: (phase) => {
				started[phase] ??= performance.now();
			}
		}
	);
	const t1 = performance.now();
	clearInterval(sampler);
	rssPeak = Math.max(rssPeak, process.memoryUsage().rss);
	if (!outcome.ok) throw new Error(`Intake refused the bench file: ${outcome.message}`);
	phases.parse.push(started.check! - started.parse!);
	phases.check.push(started.store! - started.check!);
	phases.store.push(t1 - started.store!);
	phases.total.push(t1 - t0);
	rssGrowth_MB.push((rssPeak - rss0) / 1024 / 1024);

	// The floor: parse the same bytes and insert the same rows, nothing else.
	const { db: floorDb, dir: floorDir } = freshDb();
	approvedWorld(floorDb);
	const approved = approvedLayout(
		floorDb,
		floorDb.select({ id: campaign.approvedRevisionId }).from(campaign).get()!.id!
	);
	if (!approved.ok) throw new Error(approved.message);
	const f0 = performance.now();
	const rows = Papa.parse<string[]>(new TextDecoder().decode(bytes), {
		skipEmptyLines: true
	}).data.slice(1);
	const insert = floorDb.$client.prepare(
		'insert into reading (revision_id, upload_id, point, run, kind, pressure_pa, value, unit) values (?, ?, ?, ?, ?, ?, ?, ?)'
	);
	floorDb.$client.pragma('foreign_keys = OFF');
	floorDb.$client.transaction(() => {
		for (const r of rows)
			insert.run(approved.revisionId, 'floor', +r[0]!, 1, r[1], +r[2]! * 9.80665, +r[2]!, r[3]);
	})();
	phases.floor.push(performance.now() - f0);
	if (floorDb.select().from(reading).all().length !== READINGS) throw new Error('Floor lost rows.');

	await files.close();
	db.$client.close();
	floorDb.$client.close();
	rmSync(dir, { recursive: true, force: true });
	rmSync(floorDir, { recursive: true, force: true });
}

const rowsPerSecond = phases.total.map((t) => READINGS / (t / 1000));
const ratios = phases.total.map((t, i) => t / phases.floor[i]!);
console.log(
	`Readings intake: ${READINGS.toLocaleString('en-GB')} readings, ${(bytes.length / 1024 / 1024).toFixed(1)} MiB of CSV, ${REPEATS} runs (median, min–max)`
);
console.log(`  parse             ${fmt(phases.parse)}`);
console.log(`  check             ${fmt(phases.check)}`);
console.log(`  store             ${fmt(phases.store)}`);
console.log(`  end to end        ${fmt(phases.total)}   (aim: under 3 000 ms)`);
console.log(`  rows per second   ${fmt(rowsPerSecond, 'rows/s')}`);
global.gc?.();
const heapKept_MB = (process.memoryUsage().heapUsed - heapBefore) / 1024 / 1024;
console.log(
	`  memory growth     ${rssGrowth_MB[0]!.toFixed(1)} MB RSS at peak in the first (cold) run, ${fmt(rssGrowth_MB.slice(1), 'MB', 1)} in the later runs   (aim: under 200 MB)`
);
console.log(`  heap kept         ${heapKept_MB.toFixed(1)} MB after all runs`);
console.log(`  floor             ${fmt(phases.floor)}   (Papa Parse + bare insert)`);
console.log(`  ratio to floor    ${fmt(ratios, '×', 2)}`);
