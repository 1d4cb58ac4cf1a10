import { setImmediate as nextTurn } from 'node:timers/promises';
import {
	COLUMN_LENGTH_UNITS,
	READING_PRESSURE_UNITS,
	convert,
	locatePoint,
	manometerPressure,
	pointAt,
	type MatrixPlan,
	type PointPosition,
	type RunLayout
} from '../../calc';
import {
	READING_COLUMNS,
	READING_KINDS,
	REQUIRED_READING_COLUMNS,
	readingRowSchema,
	type ReadingKind,
	type ReadingRow
} from '../../schemas/readings';
import type { ReadingProblem, ReadingsTable } from './file';

/** How far a run's rows may disagree on its reference conditions (common practice, no source). */
export const RUN_CONDITION_TOLERANCES = {
	/** Spread of the reference dynamic pressure, as a fraction of its mean. */
	dynamicPressure: 0.02,
	temperature_K: 0.5,
	/** Spread of the barometric pressure, as a fraction of its mean. */
	barometricPressure: 0.002,
	relativeHumidity: 0.05
} as const;

/**
 * Physical ranges: gauge readings of a low-speed tunnel stay far inside ±50 kPa, barometric
 * pressures on the ground lie between 30 kPa (above the highest summit) and 120 kPa, and tunnel
 * air between −40 °C and 60 °C (common practice, no source).
 */
const RANGES = {
	gauge_Pa: 50_000,
	absolute_Pa: [10_000, 200_000],
	barometric_Pa: [30_000, 120_000],
	temperature_C: [-40, 60],
	dynamicPressure_Pa: 50_000
} as const;

export const MAX_PROBLEMS_SHOWN = 100;

export type CheckedReading = {
	point: number;
	run: number;
	kind: ReadingKind;
	pressure_Pa: number;
	value: number;
	unit: string;
	inclination_deg: number | null;
	fluidDensity_kgm3: number | null;
	measuredAt: Date | null;
	note: string | null;
};

export type RunConditions = {
	run: number;
	referenceDynamicPressure_Pa: number;
	airTemperature_K: number;
	barometricPressure_Pa: number;
	relativeHumidity: number | null;
};

export type CheckOutcome =
	| { ok: true; readings: CheckedReading[]; conditions: RunConditions[] }
	| { ok: false; problems: ReadingProblem[]; problemCount: number };

export type Progress = (done: number, total: number) => void;

class Problems {
	readonly shown: ReadingProblem[] = [];
	count = 0;
	add(row: number | null, column: string | null, reason: string) {
		this.count++;
		if (this.shown.length < MAX_PROBLEMS_SHOWN) this.shown.push({ row, column, reason });
	}
	refusal(): CheckOutcome {
		return { ok: false, problems: this.shown, problemCount: this.count };
	}
}

function headerProblems(table: ReadingsTable, problems: Problems) {
	const row = table.format === 'csv' ? 1 : null;
	const known = new Set<string>(READING_COLUMNS);
	const seen = new Set<string>();
	for (const h of table.headers) {
		if (!known.has(h))
			problems.add(row, h, `is not a known column; the columns are ${READING_COLUMNS.join(', ')}`);
		else if (seen.has(h)) problems.add(row, h, 'appears twice in the header');
		seen.add(h);
	}
	for (const c of REQUIRED_READING_COLUMNS) if (!seen.has(c)) problems.add(row, c, 'is missing');
	if (!seen.has('point') && !['run', 'row', 'column'].every((c) => seen.has(c)))
		problems.add(row, 'point', 'is missing (or give run, row and column together)');
}

const pa = (n: number) => `${+n.toPrecision(6)} Pa`;

/** A running minimum, maximum and sum of one run condition. */
class Spread {
	min = Infinity;
	max = -Infinity;
	sum = 0;
	n = 0;
	add(v: number) {
		this.min = Math.min(this.min, v);
		this.max = Math.max(this.max, v);
		this.sum += v;
		this.n++;
	}
	/** Equal values give that value back exactly, without the sum's rounding. */
	get mean() {
		return this.min === this.max ? this.min : this.sum / this.n;
	}
}

type RunAccumulator = {
	firstRow: number;
	q: Spread;
	t: Spread;
	p: Spread;
	rh: Spread;
};

/** The point a row names, or a problem saying why it names none of the approved matrix. */
function locate(
	r: ReadingRow,
	layout: RunLayout,
	row: number,
	problems: Problems
): PointPosition | undefined {
	if (r.point !== undefined) {
		const at = locatePoint(layout, r.point);
		if (!at) {
			problems.add(
				row,
				'point',
				`${r.point} is not in the approved matrix (points 1–${layout.pointCount})`
			);
			return undefined;
		}
		if (r.run !== undefined && r.row !== undefined && r.column !== undefined) {
			const named = pointAt(layout, r.run, r.row, r.column);
			if (named !== r.point) {
				problems.add(
					row,
					'run',
					`run ${r.run}, row ${r.row}, column ${r.column} is ${named === undefined ? 'not in the approved matrix' : `point ${named}`}, not point ${r.point}`
				);
				return undefined;
			}
		}
		return at;
	}
	const planned = layout.runs[r.run! - 1];
	if (!planned) {
		problems.add(
			row,
			'run',
			`${r.run} is not a run of the approved matrix (runs 1–${layout.runs.length})`
		);
		return undefined;
	}
	if (r.row! > planned.rows) {
		problems.add(
			row,
			'row',
			`${r.row} is outside run ${planned.run}'s probe rows 1–${planned.rows}`
		);
		return undefined;
	}
	if (r.column! > planned.columns) {
		problems.add(
			row,
			'column',
			`${r.column} is outside run ${planned.run}'s probe columns 1–${planned.columns}`
		);
		return undefined;
	}
	const point = pointAt(layout, r.run!, r.row!, r.column!)!;
	return locatePoint(layout, point);
}

const differs = (given: number | undefined, planned: number, tolerance: number) =>
	given !== undefined && Math.abs(given - planned) > tolerance;

/** Where a file repeats the point's identity, it must be the matrix's. */
function crossCheck(
	r: ReadingRow,
	at: PointPosition,
	point: number,
	planes: Map<string, MatrixPlan['planes'][number]>,
	row: number,
	problems: Problems
) {
	const run = at.run;
	const grid = planes.get(run.planeId)!.grid;
	if (r.configuration !== undefined && r.configuration !== run.configurationId)
		problems.add(
			row,
			'configuration',
			`is “${r.configuration}”, but point ${point} belongs to “${run.configurationId}”`
		);
	if (r.plane !== undefined && r.plane !== run.planeId)
		problems.add(
			row,
			'plane',
			`is “${r.plane}”, but point ${point} lies in plane “${run.planeId}”`
		);
	if (differs(r.yaw_deg, run.yaw_deg, 1e-6))
		problems.add(row, 'yaw_deg', `is ${r.yaw_deg}°, but point ${point} is at ${run.yaw_deg}°`);
	if (differs(r.speed_mps, run.speed_mps, 1e-3 * run.speed_mps))
		problems.add(
			row,
			'speed_mps',
			`is ${r.speed_mps} m/s, but point ${point} is at ${+run.speed_mps.toFixed(4)} m/s`
		);
	if (r.repeat !== undefined && r.repeat !== run.repeat)
		problems.add(row, 'repeat', `is ${r.repeat}, but point ${point} is repeat ${run.repeat}`);
	if (differs(r.y_m, grid.y_m[at.row - 1]!, 1e-6))
		problems.add(
			row,
			'y_m',
			`is ${r.y_m} m, but point ${point} is at y = ${grid.y_m[at.row - 1]} m`
		);
	if (differs(r.z_m, grid.z_m[at.column - 1]!, 1e-6))
		problems.add(
			row,
			'z_m',
			`is ${r.z_m} m, but point ${point} is at z = ${grid.z_m[at.column - 1]} m`
		);
}

/**
 * Pressure and length units are proportional, so each unit's factor is asked of the core's
 * conversion once and reused for every row.
 */
const factors = new Map<string, number>();
function toSI(value: number, unit: string, si: 'Pa' | 'm'): number {
	const key = `${unit}>${si}`;
	let factor = factors.get(key);
	if (factor === undefined) {
		factor = convert(1, unit, si);
		factors.set(key, factor);
	}
	return value * factor;
}

const isLength = (unit: string) => (COLUMN_LENGTH_UNITS as readonly string[]).includes(unit);
const isPressure = (unit: string) => (READING_PRESSURE_UNITS as readonly string[]).includes(unit);

/** The reading in pascals, or a problem when unit and manometer columns do not go together. */
function pressureOf(r: ReadingRow, row: number, problems: Problems): number | undefined {
	const column =
		r.manometer_inclination_deg !== undefined || r.manometer_fluid_density !== undefined;
	const unit = r.unit!;
	if (column && !isLength(unit)) {
		problems.add(
			row,
			'unit',
			`is ${unit}, but a manometer column is read as a length: use ${COLUMN_LENGTH_UNITS.join(', ')}`
		);
		return undefined;
	}
	if (!column && !isPressure(unit)) {
		problems.add(
			row,
			'unit',
			`is a length: give manometer_inclination_deg or manometer_fluid_density for a column reading, or use a pressure unit`
		);
		return undefined;
	}
	const p = column
		? manometerPressure({
				height_m: toSI(r.reading!, unit, 'm'),
				fluidDensity_kgm3: r.manometer_fluid_density,
				inclination_deg: r.manometer_inclination_deg
			})
		: toSI(r.reading!, unit, 'Pa');
	const [absMin, absMax] = RANGES.absolute_Pa;
	if (r.kind === 'absolute' ? p < absMin || p > absMax : Math.abs(p) > RANGES.gauge_Pa) {
		problems.add(
			row,
			'reading',
			r.kind === 'absolute'
				? `${pa(p)} is outside the physical range of an absolute pressure (${absMin / 1000}–${absMax / 1000} kPa)`
				: `${pa(p)} is outside the physical range of a ${r.kind} reading (±${RANGES.gauge_Pa / 1000} kPa against the free stream)`
		);
		return undefined;
	}
	return p;
}

function addConditions(r: ReadingRow, acc: RunAccumulator, row: number, problems: Problems) {
	if (r.reference_dynamic_pressure !== undefined) {
		if (!r.reference_unit)
			problems.add(row, 'reference_unit', 'is required with a reference dynamic pressure');
		else {
			const q = toSI(r.reference_dynamic_pressure, r.reference_unit, 'Pa');
			if (q <= 0 || q > RANGES.dynamicPressure_Pa)
				problems.add(
					row,
					'reference_dynamic_pressure',
					`${pa(q)} is outside the physical range (above 0, up to ${RANGES.dynamicPressure_Pa / 1000} kPa)`
				);
			else acc.q.add(q);
		}
	}
	if (r.air_temperature_c !== undefined) {
		const [min, max] = RANGES.temperature_C;
		if (r.air_temperature_c < min || r.air_temperature_c > max)
			problems.add(
				row,
				'air_temperature_c',
				`${r.air_temperature_c} °C is outside ${min} to ${max} °C`
			);
		else acc.t.add(r.air_temperature_c + 273.15);
	}
	if (r.barometric_pressure !== undefined) {
		if (!r.barometric_unit)
			problems.add(row, 'barometric_unit', 'is required with a barometric pressure');
		else {
			const p = toSI(r.barometric_pressure, r.barometric_unit, 'Pa');
			const [min, max] = RANGES.barometric_Pa;
			if (p < min || p > max)
				problems.add(
					row,
					'barometric_pressure',
					`${pa(p)} is outside the physical range (${min / 1000}–${max / 1000} kPa)`
				);
			else acc.p.add(p);
		}
	}
	if (r.relative_humidity !== undefined) acc.rh.add(r.relative_humidity);
}

/** A run's reference conditions from its rows, or problems when they are missing or disagree. */
function runConditions(
	run: number,
	acc: RunAccumulator,
	problems: Problems
): RunConditions | undefined {
	const row = acc.firstRow;
	const t = RUN_CONDITION_TOLERANCES;
	let ok = true;
	const missing = (column: string, what: string) => {
		problems.add(row, column, `run ${run} has no ${what} on any of its rows`);
		ok = false;
	};
	const disagree = (column: string, text: string) => {
		problems.add(row, column, `run ${run}'s rows disagree: ${text}`);
		ok = false;
	};
	if (acc.q.n === 0) missing('reference_dynamic_pressure', 'reference dynamic pressure');
	else if (acc.q.max - acc.q.min > t.dynamicPressure * acc.q.mean)
		disagree(
			'reference_dynamic_pressure',
			`${pa(acc.q.min)} to ${pa(acc.q.max)}, more than ${t.dynamicPressure * 100} % apart`
		);
	if (acc.t.n === 0) missing('air_temperature_c', 'air temperature');
	else if (acc.t.max - acc.t.min > t.temperature_K)
		disagree(
			'air_temperature_c',
			`${+(acc.t.min - 273.15).toFixed(2)} to ${+(acc.t.max - 273.15).toFixed(2)} °C, more than ${t.temperature_K} K apart`
		);
	if (acc.p.n === 0) missing('barometric_pressure', 'barometric pressure');
	else if (acc.p.max - acc.p.min > t.barometricPressure * acc.p.mean)
		disagree(
			'barometric_pressure',
			`${pa(acc.p.min)} to ${pa(acc.p.max)}, more than ${t.barometricPressure * 100} % apart`
		);
	if (acc.rh.n > 0 && acc.rh.max - acc.rh.min > t.relativeHumidity)
		disagree(
			'relative_humidity',
			`${acc.rh.min} to ${acc.rh.max}, more than ${t.relativeHumidity} apart`
		);
	if (!ok) return undefined;
	return {
		run,
		referenceDynamicPressure_Pa: acc.q.mean,
		airTemperature_K: acc.t.mean,
		barometricPressure_Pa: acc.p.mean,
		relativeHumidity: acc.rh.n ? acc.rh.mean : null
	};
}

const YIELD_EVERY = 5000;

/**
 * Checks every row of a readings table against the approved matrix: identity, units, physical
 * ranges, duplicates and each run's reference conditions. All or nothing: any problem refuses
 * the whole file, with the first problems and their count.
 */
export async function checkReadings(
	table: ReadingsTable,
	plan: MatrixPlan,
	layout: RunLayout,
	progress: Progress = () => {}
): Promise<CheckOutcome> {
	const problems = new Problems();
	headerProblems(table, problems);
	if (problems.count) return problems.refusal();

	const planes = new Map(plan.planes.map((p) => [p.id, p]));
	const kindIndex = new Map(READING_KINDS.map((k, i) => [k, i]));
	const firstRowOf = new Map<number, number>();
	const runs = new Map<number, RunAccumulator>();
	const readings: CheckedReading[] = [];
	const total = table.records.length;
	const readingColumn = table.headers.indexOf('reading');

	for (let i = 0; i < total; i++) {
		if (i % YIELD_EVERY === 0 && i > 0) {
			progress(i, total);
			await nextTurn();
		}
		const { row, cells: values } = table.records[i]!;
		// Template rows left unfilled carry no reading; a CSV may hold only some of the points.
		if (table.format === 'csv' && !values[readingColumn]) continue;
		const cells: Record<string, unknown> = {};
		for (let k = 0; k < table.headers.length; k++) cells[table.headers[k]!] = values[k];
		const parsed = readingRowSchema.safeParse(cells);
		if (!parsed.success) {
			for (const issue of parsed.error.issues) {
				const column = issue.path.length ? String(issue.path[0]) : null;
				const given = column ? cells[column] : undefined;
				const shown = typeof given === 'string' && given !== '' ? `“${given.slice(0, 40)}” ` : '';
				problems.add(row, column, `${shown}${issue.message}`);
			}
			continue;
		}
		const r = parsed.data;
		const at = locate(r, layout, row, problems);
		if (!at) continue;
		const point = at.run.firstPoint + (at.row - 1) * at.run.columns + (at.column - 1);
		crossCheck(r, at, point, planes, row, problems);

		const key = point * READING_KINDS.length + kindIndex.get(r.kind)!;
		const earlier = firstRowOf.get(key);
		if (earlier !== undefined) {
			problems.add(row, 'kind', `point ${point} already has a ${r.kind} reading in row ${earlier}`);
			continue;
		}
		firstRowOf.set(key, row);

		let acc = runs.get(at.run.run);
		if (!acc) {
			acc = { firstRow: row, q: new Spread(), t: new Spread(), p: new Spread(), rh: new Spread() };
			runs.set(at.run.run, acc);
		}
		addConditions(r, acc, row, problems);

		const pressure_Pa = pressureOf(r, row, problems);
		if (pressure_Pa === undefined) continue;
		readings.push({
			point,
			run: at.run.run,
			kind: r.kind,
			pressure_Pa,
			value: r.reading!,
			unit: r.unit!,
			inclination_deg: r.manometer_inclination_deg ?? null,
			fluidDensity_kgm3: r.manometer_fluid_density ?? null,
			measuredAt: r.time ? new Date(r.time) : null,
			note: r.note ?? null
		});
	}
	progress(total, total);

	const conditions: RunConditions[] = [];
	for (const [run, acc] of [...runs].sort((a, b) => a[0] - b[0])) {
		const c = runConditions(run, acc, problems);
		if (c) conditions.push(c);
	}
	if (problems.count) return problems.refusal();
	if (readings.length === 0) {
		problems.add(null, 'reading', 'no row has a reading: fill the reading column');
		return problems.refusal();
	}
	return { ok: true, readings, conditions };
}
