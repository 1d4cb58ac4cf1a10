import {
	locatePoint,
	pointAt,
	type MatrixPlan,
	type PointPosition,
	type RunLayout
} from '../../calc';
import type { ReadingRow } from '../../schemas/readings';
import type { ProblemList } from './problems';

export type LocatedRow = PointPosition & { point: number };

/**
 * The point a row names, by its point number or by run, probe row and column, or a problem
 * saying why it names none of the approved matrix. Where a row gives both, they must agree.
 */
export function locateRow(
	r: ReadingRow,
	layout: RunLayout,
	row: number,
	problems: ProblemList
): LocatedRow | undefined {
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
		return { ...at, point: r.point };
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
	const outside = (column: 'row' | 'column', given: number, count: number) =>
		problems.add(
			row,
			column,
			`${given} is outside run ${planned.run}'s probe ${column}s 1–${count}`
		);
	if (r.row! > planned.rows) return void outside('row', r.row!, planned.rows);
	if (r.column! > planned.columns) return void outside('column', r.column!, planned.columns);
	const point = pointAt(layout, r.run!, r.row!, r.column!)!;
	return { run: planned, row: r.row!, column: r.column!, point };
}

const differs = (given: number | undefined, planned: number, tolerance: number) =>
	given !== undefined && Math.abs(given - planned) > tolerance;

/** Where a row repeats its point's identity (configuration, yaw, plane, position…), it must be the matrix's. */
export function checkIdentity(
	r: ReadingRow,
	at: LocatedRow,
	planes: ReadonlyMap<string, MatrixPlan['planes'][number]>,
	row: number,
	problems: ProblemList
) {
	const { run, point } = at;
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
	const y_m = grid.y_m[at.row - 1]!;
	const z_m = grid.z_m[at.column - 1]!;
	if (differs(r.y_m, y_m, 1e-6))
		problems.add(row, 'y_m', `is ${r.y_m} m, but point ${point} is at y = ${y_m} m`);
	if (differs(r.z_m, z_m, 1e-6))
		problems.add(row, 'z_m', `is ${r.z_m} m, but point ${point} is at z = ${z_m} m`);
}
