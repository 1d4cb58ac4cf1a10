import { matrixRow, validatePlan, type MatrixPlan, type MatrixRow } from './matrix';
import { speedConditions } from './speed-conditions';

/** What names a traverse of the matrix: one plane at one configuration, yaw, speed and repeat. */
export type RunIdentity = {
	run: number;
	configurationId: string;
	yaw_deg: number;
	speed_mps: number;
	planeId: string;
	repeat: number;
};

export type PlannedRun = RunIdentity & {
	/** Point number of the run's first probe position (row 1, column 1). */
	firstPoint: number;
	rows: number;
	columns: number;
};

export type RunLayout = {
	runs: PlannedRun[];
	pointCount: number;
};

/**
 * The matrix's runs in run order with the point numbers each covers, numbered exactly as
 * expandMatrix numbers its rows, without building a row per point: readings of 100 000 points
 * are located by arithmetic.
 */
export function runLayout(plan: MatrixPlan): RunLayout {
	validatePlan(plan);
	const runs: PlannedRun[] = [];
	let firstPoint = 1;
	for (const configuration of plan.configurations) {
		for (const yaw_deg of plan.yawAngles_deg) {
			for (const speed_mps of plan.speeds_mps) {
				for (const plane of plan.planes) {
					const rows = plane.grid.y_m.length;
					const columns = plane.grid.z_m.length;
					for (let repeat = 1; repeat <= plan.repeats; repeat++) {
						runs.push({
							run: runs.length + 1,
							firstPoint,
							configurationId: configuration.id,
							yaw_deg,
							speed_mps,
							planeId: plane.id,
							repeat,
							rows,
							columns
						});
						firstPoint += rows * columns;
					}
				}
			}
		}
	}
	return { runs, pointCount: firstPoint - 1 };
}

export type PointPosition = { run: PlannedRun; row: number; column: number };

/** The run, probe row and column of a point number; undefined when the matrix has no such point. */
export function locatePoint(layout: RunLayout, point: number): PointPosition | undefined {
	if (!Number.isInteger(point) || point < 1 || point > layout.pointCount) return undefined;
	let lo = 0;
	let hi = layout.runs.length - 1;
	while (lo < hi) {
		const mid = (lo + hi + 1) >> 1;
		if (layout.runs[mid]!.firstPoint <= point) lo = mid;
		else hi = mid - 1;
	}
	const run = layout.runs[lo]!;
	const offset = point - run.firstPoint;
	return { run, row: Math.floor(offset / run.columns) + 1, column: (offset % run.columns) + 1 };
}

/** The point number of a run's probe row and column; undefined outside the matrix. */
export function pointAt(
	layout: RunLayout,
	run: number,
	row: number,
	column: number
): number | undefined {
	const r = Number.isInteger(run) ? layout.runs[run - 1] : undefined;
	if (!r || !Number.isInteger(row) || !Number.isInteger(column)) return undefined;
	if (row < 1 || row > r.rows || column < 1 || column > r.columns) return undefined;
	return r.firstPoint + (row - 1) * r.columns + (column - 1);
}

/**
 * The rows of points offset + 1 … offset + limit, built by arithmetic on the run layout: a page
 * of a large matrix costs the page, not the matrix.
 */
export function matrixRows(plan: MatrixPlan, offset: number, limit: number): MatrixRow[] {
	const layout = runLayout(plan);
	const conditions = new Map(speedConditions(plan).map((c) => [c.speed_mps, c]));
	const planes = new Map(plan.planes.map((p) => [p.id, p]));
	const rows: MatrixRow[] = [];
	const last = Math.min(layout.pointCount, offset + limit);
	for (let point = offset + 1; point <= last; point++) {
		const { run, row, column } = locatePoint(layout, point)!;
		const { configurationId, yaw_deg, repeat } = run;
		rows.push(
			matrixRow(
				conditions.get(run.speed_mps)!,
				planes.get(run.planeId)!,
				{ point, run: run.run, configurationId, yaw_deg, repeat },
				row - 1,
				column - 1
			)
		);
	}
	return rows;
}
