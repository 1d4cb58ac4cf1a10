import { sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import type { SessionUser } from '../../src/lib/roles';
import type { Db } from '../../src/lib/server/db/open';
import { auditEvent, reading, readingsUpload, runCondition } from '../../src/lib/server/db/schema';
import {
	readingsOverview,
	readingsTemplate,
	receiveReadings,
	type ReadingsFile
} from '../../src/lib/server/readings';
import { approvedCampaignWorld } from './campaign-fixtures';
import { tempDb } from './temp-db';
import { tempStore } from './temp-store';

const ORIGIN = 'http://localhost';
const HEADER =
	'point,kind,reading,unit,reference_dynamic_pressure,reference_unit,air_temperature_C,barometric_pressure,barometric_unit,relative_humidity';

/** The approved campaign of the fixtures is the demo's AM-3 sweep: 9 runs of a 4 × 5 plane. */
function world() {
	const db = tempDb();
	const w = approvedCampaignWorld(db, ORIGIN);
	const store = tempStore();
	const send = (
		text: string | Uint8Array,
		options: { replace?: boolean; as?: SessionUser; mediaType?: ReadingsFile['mediaType'] } = {}
	) =>
		receiveReadings(
			db,
			store,
			options.as ?? w.aeroA,
			w.campaignId,
			{
				fileName: 'run.csv',
				mediaType: options.mediaType ?? 'text/csv',
				bytes: typeof text === 'string' ? new TextEncoder().encode(text) : text,
				channel: 'page'
			},
			{ replace: options.replace }
		);
	return { db, w, store, send };
}

/** Static readings for every point of a run, with one set of reference conditions. */
function runRows(run: number, reading = (i: number) => -1 - i / 10, q = 250) {
	return Array.from(
		{ length: 20 },
		(_, i) => `${(run - 1) * 20 + i + 1},static,${reading(i)},mmH2O,${q},Pa,18.5,998.2,hPa,0.55`
	);
}

const csv = (...lines: string[]) => [HEADER, ...lines].join('\n') + '\n';

function counts(db: Db) {
	const n = (
		table: typeof reading | typeof readingsUpload | typeof runCondition | typeof auditEvent
	) =>
		db
			.select({ n: sql<number>`count(*)` })
			.from(table)
			.get()!.n;
	return {
		readings: n(reading),
		uploads: n(readingsUpload),
		conditions: n(runCondition),
		audit: n(auditEvent)
	};
}

describe('receiving readings', () => {
	it('stores a run, converts its units and shows the coverage', async () => {
		const { db, w, send } = world();
		const stored = await send(csv(...runRows(1)));
		expect(stored).toMatchObject({ ok: true, readingCount: 20, runCount: 1, replacedCount: 0 });
		const first = db
			.select()
			.from(reading)
			.where(sql`point = 1`)
			.get()!;
		// NIST SP 811 (2008) Appendix B.8: 1 conventional mmH2O = 9.806 65 Pa.
		expect(first.pressure_Pa).toBeCloseTo(-1 * 9.80665, 10);
		const conditions = db.select().from(runCondition).get()!;
		expect(conditions.barometricPressure_Pa).toBe(99_820);
		expect(conditions.airTemperature_K).toBeCloseTo(291.65, 10);

		const coverage = readingsOverview(db, w.aeroA, w.campaignId)!.coverage;
		expect(coverage.plannedPoints).toBe(180);
		expect(coverage.pointsWithReadings).toBe(20);
		expect(coverage.runs).toEqual({ planned: 9, complete: 1, partial: 0, missing: 8 });
		expect(coverage.missingRuns).toEqual([2, 3, 4, 5, 6, 7, 8, 9]);
		expect(coverage.perPlane).toEqual([
			{ planeId: 'wake', plannedPoints: 180, pointsWithReadings: 20, runs: 9, runsComplete: 1 }
		]);
	});

	it('converts inches of water, mmHg and inclined manometer columns', async () => {
		const { db, send } = world();
		const text = [
			`${HEADER},manometer_inclination_deg,manometer_fluid_density`,
			'1,total,0.1,inH2O,250,Pa,18.5,998.2,hPa,0.55,,',
			'1,absolute,750,mmHg,250,Pa,18.5,998.2,hPa,0.55,,',
			'2,static,50,mm,250,Pa,18.5,998.2,hPa,0.55,20,826'
		].join('\n');
		expect(await send(text)).toMatchObject({ ok: true, readingCount: 3 });
		const byPoint = (point: number, kind: string) =>
			db
				.select()
				.from(reading)
				.where(sql`point = ${point} and kind = ${kind}`)
				.get()!.pressure_Pa;
		// NIST SP 811 (2008) Appendix B.8: 1 conventional inH2O = 249.0889 Pa, 1 mmHg = 133.3224 Pa.
		expect(byPoint(1, 'total')).toBeCloseTo(24.90889, 8);
		expect(byPoint(1, 'absolute')).toBeCloseTo(99_991.8, 6);
		// Inclined manometer Δp = ρ g L sin θ (White, Fluid Mechanics, §2.4), evaluated by hand:
		// 0.05 m × 826 kg/m³ × 9.80665 m/s² × sin 20° = 138.523 Pa.
		expect(byPoint(2, 'static')).toBeCloseTo(138.523, 3);
	});

	it('accepts run, row and column instead of the point, semicolons with decimal commas, tabs and a BOM', async () => {
		const { db, send } = world();
		const byRun =
			'run;row;column;kind;reading;unit;reference_dynamic_pressure;reference_unit;air_temperature_C;barometric_pressure;barometric_unit\n' +
			'2;1;1;static;-2,5;mmH2O;250,5;Pa;18,5;998,2;hPa\n';
		expect(await send(byRun)).toMatchObject({ ok: true, readingCount: 1 });
		const point21 = db
			.select()
			.from(reading)
			.where(sql`point = 21`)
			.get()!;
		expect(point21.value).toBe(-2.5);

		const tabbed = '\uFEFF' + csv(runRows(3)[0]!).replaceAll(',', '\t');
		expect(await send(tabbed)).toMatchObject({ ok: true, readingCount: 1 });
	});

	it('takes JSON with the same fields', async () => {
		const { send } = world();
		const body = JSON.stringify({
			readings: [
				{
					point: 5,
					kind: 'static',
					reading: -12.5,
					unit: 'Pa',
					reference_dynamic_pressure: 2.55,
					reference_unit: 'mbar',
					air_temperature_C: 18,
					barometric_pressure: 99.8,
					barometric_unit: 'kPa',
					relative_humidity: '55%'
				}
			]
		});
		expect(await send(body, { mediaType: 'application/json' })).toMatchObject({
			ok: true,
			readingCount: 1
		});
	});
});

describe('a bad file stores nothing and says why', () => {
	const good = runRows(1)[0]!;
	const corpus: [
		string,
		string | Uint8Array,
		{ row: number | null; column: string | null; reason: RegExp }
	][] = [
		[
			'an unknown column',
			csv(good).replace('relative_humidity', 'humidity'),
			{ row: 1, column: 'humidity', reason: /not a known column/ }
		],
		[
			'a missing column',
			csv(good).replace(',unit,', ',').replace(',mmH2O,', ','),
			{ row: 1, column: 'unit', reason: /missing/ }
		],
		[
			'text in a number',
			csv(good.replace(',-1,', ',about one,')),
			{ row: 2, column: 'reading', reason: /not a number/ }
		],
		[
			'an unknown unit',
			csv(good.replace('mmH2O', 'cmH2O')),
			{ row: 2, column: 'unit', reason: /not a pressure unit/ }
		],
		[
			'a point outside the matrix',
			csv(good.replace(/^1,/, '181,')),
			{ row: 2, column: 'point', reason: /not in the approved matrix/ }
		],
		[
			'a point and kind given twice',
			csv(good, good),
			{ row: 3, column: 'kind', reason: /already has a static reading in row 2/ }
		],
		[
			'a run whose conditions disagree',
			csv(good, runRows(1, undefined, 300)[1]!),
			{ row: 2, column: 'reference_dynamic_pressure', reason: /disagree/ }
		],
		[
			'a humidity over 100 %',
			csv(good.replace(/0\.55$/, '150')),
			{ row: 2, column: 'relative_humidity', reason: /above 100 %/ }
		],
		[
			'a barometric pressure outside the physical range',
			csv(good.replace(',998.2,hPa', ',998.2,Pa')),
			{ row: 2, column: 'barometric_pressure', reason: /physical range/ }
		],
		['an empty file', '', { row: null, column: null, reason: /empty/ }],
		[
			'a binary file',
			new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]),
			{ row: null, column: null, reason: /not text/ }
		],
		[
			'a single column',
			'point kind reading\n1 static 2\n',
			{ row: null, column: null, reason: /single column/ }
		],
		[
			'a template with nothing filled in',
			csv(good.replace(',-1,', ',,')),
			{ row: null, column: 'reading', reason: /no row has a reading/ }
		],
		[
			'a reading of a length without manometer columns',
			csv(good.replace('mmH2O', 'mm')),
			{ row: 2, column: 'unit', reason: /is a length/ }
		]
	];

	it.each(corpus)('refuses %s', async (_, text, problem) => {
		const { db, send } = world();
		const before = counts(db);
		const outcome = await send(text);
		expect(outcome.ok).toBe(false);
		if (outcome.ok) return;
		expect(outcome.code).toBe('invalid');
		expect(outcome.problems?.[0]).toMatchObject({ row: problem.row, column: problem.column });
		expect(outcome.problems?.[0]?.reason).toMatch(problem.reason);
		expect(counts(db)).toEqual(before);
	});

	it('lists the first 100 problems and counts them all', async () => {
		const { db, send } = world();
		const rows = Array.from(
			{ length: 150 },
			(_, i) => `${i + 1},static,x,mmH2O,250,Pa,18.5,998.2,hPa,0.55`
		);
		const outcome = await send(csv(...rows));
		expect(outcome).toMatchObject({ ok: false, code: 'invalid', problemCount: 150 });
		if (!outcome.ok) expect(outcome.problems).toHaveLength(100);
		expect(counts(db).readings).toBe(0);
	});
});

describe('replacing readings', () => {
	it('refuses readings of points already read unless told to replace, and keeps what it replaced', async () => {
		const { db, w, send } = world();
		await send(csv(...runRows(1)));
		const before = counts(db);

		const again = await send(csv(...runRows(1, (i) => -2 - i / 10)));
		expect(again).toMatchObject({ ok: false, code: 'conflict', pointCount: 20 });
		if (!again.ok) expect(again.points?.slice(0, 3)).toEqual([1, 2, 3]);
		expect(counts(db)).toEqual(before);

		const replaced = await send(csv(...runRows(1, (i) => -2 - i / 10)), { replace: true });
		expect(replaced).toMatchObject({ ok: true, replacedCount: 20 });
		const all = db
			.select()
			.from(reading)
			.where(sql`point = 1`)
			.all();
		expect(all.map((r) => [r.value, r.supersededBy === null])).toEqual([
			[-1, false],
			[-2, true]
		]);
		const trail = db
			.select()
			.from(auditEvent)
			.where(sql`action = 'replace-readings'`)
			.get()!;
		expect(trail.actorId).toBe(w.aeroA.id);
		expect(trail.notes).toMatch(/replaced 20 reading\(s\) of 20 point\(s\)/);
		expect(readingsOverview(db, w.aeroA, w.campaignId)!.coverage.readingCount).toBe(20);
	});

	it('treats other reference conditions for a stored run as a replacement too', async () => {
		const { db, send } = world();
		await send(csv(runRows(1)[0]!));
		const other = csv(runRows(1, undefined, 300)[1]!);
		expect(await send(other)).toMatchObject({ ok: false, code: 'conflict', runs: [1] });
		expect(await send(other, { replace: true })).toMatchObject({ ok: true });
		expect(
			db
				.select()
				.from(runCondition)
				.where(sql`superseded_by is null`)
				.get()!.referenceDynamicPressure_Pa
		).toBe(300);
	});
});

describe('who may send readings, and where they go', () => {
	it('takes them from the team and operators, refuses reviewers, hides the campaign from others', async () => {
		const { w, send } = world();
		expect(await send(csv(runRows(1)[0]!), { as: w.operator })).toMatchObject({ ok: true });
		expect(await send(csv(runRows(1)[1]!), { as: w.aeroA2 })).toMatchObject({ ok: true });
		expect(await send(csv(runRows(1)[2]!), { as: w.reviewer })).toMatchObject({
			ok: false,
			code: 'forbidden'
		});
		expect(await send(csv(runRows(1)[3]!), { as: w.aeroB })).toMatchObject({
			ok: false,
			code: 'not-found'
		});
	});

	it('attaches readings to the approved revision while a new draft is open', async () => {
		const { db, w, send } = world();
		const { moveCampaign } = await import('../../src/lib/server/review');
		expect(moveCampaign(db, w.aeroA, w.campaignId, 'revise').ok).toBe(true);
		expect(await send(csv(runRows(1)[0]!))).toMatchObject({ ok: true });
		const stored = db.select().from(reading).get()!;
		const upload = db.select().from(readingsUpload).get()!;
		expect(stored.revisionId).toBe(upload.revisionId);
		expect(readingsOverview(db, w.aeroA, w.campaignId)!.revisionNumber).toBe(1);
	});

	it('writes a template with a row per planned point that comes back as a valid file', async () => {
		const { w, db, send } = world();
		const template = readingsTemplate(db, w.aeroA, w.campaignId);
		expect(template.ok).toBe(true);
		if (!template.ok) return;
		const lines = template.csv.trim().split('\n');
		expect(lines).toHaveLength(181);
		const header = lines[0]!.split(',');
		const filled = lines.slice(1, 21).map((line) => {
			const cells = line.split(',');
			const set = (column: string, value: string) => (cells[header.indexOf(column)] = value);
			set('reading', '-1.5');
			set('reference_dynamic_pressure', '250');
			set('air_temperature_c', '18');
			set('barometric_pressure', '998');
			return cells.join(',');
		});
		expect(await send([lines[0], ...filled, ...lines.slice(21)].join('\n'))).toMatchObject({
			ok: true,
			readingCount: 20
		});
	});
});
