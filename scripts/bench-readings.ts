/**
 * Benchmark of readings intake: parses, checks and stores 100 000 readings of a 108 000-point
 * approved campaign, five times on fresh databases, and prints the median and range of each
 * phase, rows per second and memory growth. The floor, measured in the same run, is csv-parse
 * reading the same bytes plus a bare insert of the same rows in one transaction: the work that
 * no intake can skip. The ratio says what checking and bookkeeping cost on top of it.
 */
import Papa from 'papaparse';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createCampaign } from '../src/lib/server/campaigns';
import { migrateDatabase, openDatabase, type Db } from '../src/lib/server/db/open';
import {
	campaign,
	facility,
	reading,
	scaleModel,
	team,
	teamMember,
	user,
	userRole
} from '../src/lib/server/db/schema';
import { approvedLayout, receiveReadings, type ReceivePhase } from '../src/lib/server/readings';
import { decideRevision, submitCampaign } from '../src/lib/server/review';
import { diskBlobStore } from '../src/lib/server/storage';
import { sessionUser } from '../src/lib/server/users';
import { DEMO_CAMPAIGNS, DEMO_FACILITIES, DEMO_MODELS } from './demo-scenario';

const READINGS = 100_000;
const REPEATS = 5;
const ORIGIN = 'http://localhost';

function person(db: Db, email: string, roles: ('aerodynamicist' | 'reviewer')[], teamId: string) {
	const id = db.insert(user).values({ email, name: email }).returning({ id: user.id }).get().id;
	db.insert(userRole)
		.values(roles.map((role) => ({ userId: id, role })))
		.run();
	db.insert(teamMember).values({ teamId, userId: id }).run();
	return sessionUser(db, id, 1)!;
}

/** An approved campaign of the demo's wake survey, run twice over: 108 000 points. */
function approvedWorld(db: Db) {
	const client = db.insert(team).values({ name: 'Client', kind: 'client' }).returning().get().id;
	const staff = db.insert(team).values({ name: 'Staff', kind: 'staff' }).returning().get().id;
	const aero = person(db, 'aero@example.org', ['aerodynamicist'], client);
	const reviewer = person(db, 'reviewer@example.org', ['reviewer'], staff);
	const facilityId = db.insert(facility).values(DEMO_FACILITIES[0]!).returning().get().id;
	const modelId = db
		.insert(scaleModel)
		.values({ ...DEMO_MODELS[0]!.model, teamId: client })
		.returning()
		.get().id;
	const created = createCampaign(db, aero, {
		...DEMO_CAMPAIGNS[0]!.input,
		repeats: 2,
		modelId,
		facilityId
	});
	if (!created.ok) throw new Error(created.message);
	submitCampaign(db, aero, created.id, ORIGIN);
	const decided = decideRevision(
		db,
		reviewer,
		created.id,
		{ revision: 1, verdict: 'approve', summary: '', notes: [] },
		ORIGIN
	);
	if (!decided.ok) throw new Error(decided.message);
	return { aero, campaignId: created.id };
}

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

function freshDb() {
	const dir = mkdtempSync(join(tmpdir(), 'tunnelwright-bench-'));
	const db = openDatabase(join(dir, 'bench.db'));
	migrateDatabase(db);
	return { db, dir };
}

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
	const store = diskBlobStore(join(dir, 'blobs'));
	global.gc?.();
	const rss0 = process.memoryUsage().rss;
	let rssPeak = rss0;
	const sampler = setInterval(() => (rssPeak = Math.max(rssPeak, process.memoryUsage().rss)), 10);
	const started: Partial<Record<ReceivePhase, number>> = {};
	const t0 = performance.now();
	const outcome = await receiveReadings(
		db,
		store,
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
