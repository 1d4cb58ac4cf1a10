import type { Grid, PlannedRun, RunLayout } from '../calc';

/** Kinds as stored, in the order the reading table numbers them. */
export const KIND_INDEX = { static: 0, total: 1, absolute: 2 } as const;

/** A revision's current readings, sorted by point, as parallel columns. */
export type ReadingColumns = {
	point: ArrayLike<number>;
	kind: ArrayLike<number>;
	pressure_Pa: ArrayLike<number>;
};

export const emptyGrid = (rows: number, columns: number): Grid =>
	Array.from({ length: rows }, () => new Array<number | null>(columns).fill(null));

export type RunReadings = { run: PlannedRun; gauge: Grid; total: Grid; absolute: number };

/** Readings sorted by point fall into runs in order: each run is a contiguous range of points. */
export function readingsByRun(layout: RunLayout, readings: ReadingColumns): RunReadings[] {
	const byRun: RunReadings[] = [];
	let r = 0;
	let current = null as RunReadings | null;
	for (let i = 0; i < readings.point.length; i++) {
		const point = readings.point[i]!;
		while (r + 1 < layout.runs.length && layout.runs[r + 1]!.firstPoint <= point) r++;
		const run = layout.runs[r]!;
		if (current?.run !== run) {
			current = {
				run,
				gauge: emptyGrid(run.rows, run.columns),
				total: emptyGrid(run.rows, run.columns),
				absolute: 0
			};
			byRun.push(current);
		}
		const offset = point - run.firstPoint;
		const row = Math.floor(offset / run.columns);
		const column = offset % run.columns;
		const kind = readings.kind[i]!;
		if (kind === KIND_INDEX.static) current.gauge[row]![column] = readings.pressure_Pa[i]!;
		else if (kind === KIND_INDEX.total) current.total[row]![column] = readings.pressure_Pa[i]!;
		else current.absolute++;
	}
	return byRun;
}

export const mapGrid = (grid: Grid, f: (v: number) => number): Grid =>
	grid.map((row) => row.map((v) => (v === null ? null : f(v))));

export const sameCell = (a: PlannedRun, b: PlannedRun) =>
	a.yaw_deg === b.yaw_deg &&
	a.speed_mps === b.speed_mps &&
	a.planeId === b.planeId &&
	a.repeat === b.repeat;
