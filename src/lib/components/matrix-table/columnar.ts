import { runLayout, speedConditions, type MatrixPlan, type MatrixRow } from '$lib/calc';
import type { MatrixColumnId } from './columns';

/**
 * The matrix as one typed array per quantity instead of one object per point: sorting, filtering
 * and grouping read numbers straight from memory, and a cell is looked up only when it is on
 * screen. A point is its index in run order.
 */
export type ColumnarMatrix = {
	length: number;
	/** Every quantity as numbers; a label column holds codes into `labels`. */
	values: Record<MatrixColumnId, Float64Array>;
	/** The distinct ids of each label column, in the order they are first run. */
	labels: Partial<Record<MatrixColumnId, string[]>>;
};

/**
 * The plan's points in columns, numbered as `expandMatrix` numbers its rows. Filled run by run
 * from the core's run layout: a run's quantities are the same for all its points, so most columns
 * are filled a run at a time and no row object is ever built.
 */
export function planColumns(plan: MatrixPlan): ColumnarMatrix {
	const { runs, pointCount: n } = runLayout(plan);
	const conditions = new Map(speedConditions(plan).map((c) => [c.speed_mps, c]));
	const planes = new Map(plan.planes.map((p, code) => [p.id, { plane: p, code }]));
	const configurations = new Map(plan.configurations.map((c, code) => [c.id, code]));
	const column = () => new Float64Array(n);
	const values: Record<MatrixColumnId, Float64Array> = {
		point: column(),
		run: column(),
		configurationId: column(),
		yaw_deg: column(),
		speed_mps: column(),
		planeId: column(),
		downstream_m: column(),
		repeat: column(),
		row: column(),
		column: column(),
		y_m: column(),
		z_m: column(),
		modelRe: column(),
		dynamicPressure_Pa: column(),
		dynamicPressure_mmH2O: column(),
		mach: column(),
		correctedDynamicPressure_Pa: column()
	};
	for (const run of runs) {
		const from = run.firstPoint - 1;
		const to = from + run.rows * run.columns;
		const condition = conditions.get(run.speed_mps)!;
		const { plane, code: planeCode } = planes.get(run.planeId)!;
		values.run.fill(run.run, from, to);
		values.configurationId.fill(configurations.get(run.configurationId)!, from, to);
		values.yaw_deg.fill(run.yaw_deg, from, to);
		values.planeId.fill(planeCode, from, to);
		values.downstream_m.fill(plane.downstream_m, from, to);
		values.repeat.fill(run.repeat, from, to);
		values.speed_mps.fill(condition.speed_mps, from, to);
		values.modelRe.fill(condition.modelRe, from, to);
		values.dynamicPressure_Pa.fill(condition.dynamicPressure_Pa, from, to);
		values.dynamicPressure_mmH2O.fill(condition.dynamicPressure_mmH2O, from, to);
		values.mach.fill(condition.mach, from, to);
		values.correctedDynamicPressure_Pa.fill(condition.correctedDynamicPressure_Pa, from, to);
		let point = from;
		for (let i = 0; i < run.rows; i++) {
			for (let j = 0; j < run.columns; j++) {
				values.point[point] = point + 1;
				values.row[point] = i + 1;
				values.column[point] = j + 1;
				values.y_m[point] = plane.grid.y_m[i]!;
				values.z_m[point] = plane.grid.z_m[j]!;
				point++;
			}
		}
	}
	return {
		length: n,
		values,
		// Configurations and planes are run in the plan's order, so that is their first-run order.
		labels: {
			configurationId: plan.configurations.map((c) => c.id),
			planeId: plan.planes.map((p) => p.id)
		}
	};
}

/** What a point holds in one column, as `expandMatrix`'s row has it. */
export function valueAt(
	matrix: ColumnarMatrix,
	id: MatrixColumnId,
	point: number
): MatrixRow[MatrixColumnId] {
	const value = matrix.values[id][point]!;
	const labels = matrix.labels[id];
	return labels ? labels[value]! : value;
}
