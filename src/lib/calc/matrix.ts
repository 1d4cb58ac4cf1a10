import type { AirState } from './air-state';
import {
	CalcInputError,
	requireFinite,
	requireNonNegative,
	requirePositive,
	requireWholeNumber
} from './errors';
import type { ProbeGrid } from './probe-grid';
import { speedConditions, type SpeedCondition } from './speed-conditions';

export const MAX_POINTS_PER_PLANE = 10_000;
export const MAX_MATRIX_POINTS = 250_000;
/**
 * The longest list of each kind a matrix may hold. Checked before anything is built from a
 * request, so a count in the input never decides how much memory or time the server spends.
 */
export const MATRIX_LIST_LIMITS = {
	configurations: 40,
	speeds: 200,
	yawAngles: 721,
	planes: 40,
	repeats: 20
} as const;

export type MeasurementPlane = {
	id: string;
	/** Distance downstream of the model's reference point. */
	downstream_m: number;
	grid: ProbeGrid;
};

export type Configuration = { id: string; baseline?: boolean };

/**
 * A test matrix: every configuration is run at every yaw angle and speed, and at each of those
 * every measurement plane is traversed point by point, `repeats` times.
 */
export type MatrixPlan = {
	configurations: Configuration[];
	speeds_mps: number[];
	yawAngles_deg: number[];
	planes: MeasurementPlane[];
	dwellPerPoint_s: number;
	repeats: number;
	/** Model-scale length Re is based on. */
	modelReferenceLength_m: number;
	tunnelAir: AirState;
	/** q_c/q_u from the blockage correction; 1 when none applies. */
	dynamicPressureFactor?: number;
};

/** One measured point, in run order. */
export type MatrixRow = SpeedCondition & {
	/** 1-based position in the run order. */
	point: number;
	/** 1-based traverse number: one plane at one configuration, yaw, speed and repeat. */
	run: number;
	configurationId: string;
	yaw_deg: number;
	planeId: string;
	downstream_m: number;
	repeat: number;
	row: number;
	column: number;
	y_m: number;
	z_m: number;
};

function requireDistinct(parameter: string, values: readonly (number | string)[]): void {
	const seen = new Set<number | string>();
	for (const v of values) {
		if (seen.has(v)) throw new CalcInputError(parameter, v, 'values that each appear once');
		seen.add(v);
	}
}

function requireAxis(parameter: string, values: readonly unknown[]): void {
	if (!Array.isArray(values) || values.length === 0) {
		throw new CalcInputError(parameter, '[]', 'at least one value');
	}
}

export function pointsPerPass(plan: Pick<MatrixPlan, 'planes'>): number {
	return plan.planes.reduce((n, p) => n + p.grid.y_m.length * p.grid.z_m.length, 0);
}

/** Number of measured points: configurations × yaw angles × speeds × plane points × repeats. */
export function matrixSize(plan: MatrixPlan): number {
	return (
		plan.configurations.length *
		plan.yawAngles_deg.length *
		plan.speeds_mps.length *
		pointsPerPass(plan) *
		plan.repeats
	);
}

/** Checks the plan's shape and values; throws CalcInputError naming the first problem. */
export function validatePlan(plan: MatrixPlan): void {
	requireAxis('configurations', plan.configurations);
	requireAxis('speeds_mps', plan.speeds_mps);
	requireAxis('yawAngles_deg', plan.yawAngles_deg);
	requireAxis('planes', plan.planes);
	requireDistinct(
		'configurations.id',
		plan.configurations.map((c) => c.id)
	);
	plan.speeds_mps.forEach((v, i) => requirePositive(`speeds_mps[${i}]`, v));
	requireDistinct('speeds_mps', plan.speeds_mps);
	plan.yawAngles_deg.forEach((v, i) => requireFinite(`yawAngles_deg[${i}]`, v));
	requireDistinct('yawAngles_deg', plan.yawAngles_deg);
	requireDistinct(
		'planes.id',
		plan.planes.map((p) => p.id)
	);
	plan.planes.forEach((plane, i) => {
		requireFinite(`planes[${i}].downstream_m`, plane.downstream_m);
		requireAxis(`planes[${i}].grid.y_m`, plane.grid.y_m);
		requireAxis(`planes[${i}].grid.z_m`, plane.grid.z_m);
		plane.grid.y_m.forEach((v, k) => requireFinite(`planes[${i}].grid.y_m[${k}]`, v));
		plane.grid.z_m.forEach((v, k) => requireFinite(`planes[${i}].grid.z_m[${k}]`, v));
		const points = plane.grid.y_m.length * plane.grid.z_m.length;
		if (points > MAX_POINTS_PER_PLANE) {
			throw new CalcInputError(
				`planes[${i}].grid`,
				`${points} points`,
				`at most ${MAX_POINTS_PER_PLANE} points in one plane`
			);
		}
	});
	requireNonNegative('dwellPerPoint_s', plan.dwellPerPoint_s);
	requireWholeNumber('repeats', plan.repeats, 1);
	requirePositive('modelReferenceLength_m', plan.modelReferenceLength_m);
	requirePositive('dynamicPressureFactor', plan.dynamicPressureFactor ?? 1);
	const size = matrixSize(plan);
	if (size > MAX_MATRIX_POINTS) {
		throw new CalcInputError(
			'matrix',
			`${size} points`,
			`at most ${MAX_MATRIX_POINTS} points in one matrix`
		);
	}
}

/**
 * Expands the plan into one row per measured point, in run order: configuration, then yaw,
 * then speed, then plane, then repeat, then the plane's points row by row. Flow quantities
 * depend only on the speed, so each is computed once per speed and shared.
 */
/** One measured point's row: where it is, under which run, and its speed's conditions. */
export function matrixRow(
	condition: SpeedCondition,
	plane: MeasurementPlane,
	at: Pick<MatrixRow, 'point' | 'run' | 'configurationId' | 'yaw_deg' | 'repeat'>,
	rowIndex: number,
	columnIndex: number
): MatrixRow {
	return {
		speed_mps: condition.speed_mps,
		modelRe: condition.modelRe,
		dynamicPressure_Pa: condition.dynamicPressure_Pa,
		dynamicPressure_mmH2O: condition.dynamicPressure_mmH2O,
		mach: condition.mach,
		correctedDynamicPressure_Pa: condition.correctedDynamicPressure_Pa,
		...at,
		planeId: plane.id,
		downstream_m: plane.downstream_m,
		row: rowIndex + 1,
		column: columnIndex + 1,
		y_m: plane.grid.y_m[rowIndex]!,
		z_m: plane.grid.z_m[columnIndex]!
	};
}

export function expandMatrix(plan: MatrixPlan): MatrixRow[] {
	validatePlan(plan);
	const conditions = speedConditions(plan);
	const rows: MatrixRow[] = [];
	let point = 0;
	let run = 0;
	for (const configuration of plan.configurations) {
		for (const yaw_deg of plan.yawAngles_deg) {
			for (const condition of conditions) {
				for (const plane of plan.planes) {
					for (let repeat = 1; repeat <= plan.repeats; repeat++) {
						run++;
						const { y_m: ys, z_m: zs } = plane.grid;
						for (let i = 0; i < ys.length; i++) {
							for (let j = 0; j < zs.length; j++) {
								rows.push(
									matrixRow(
										condition,
										plane,
										{ point: point + 1, run, configurationId: configuration.id, yaw_deg, repeat },
										i,
										j
									)
								);
								point++;
							}
						}
					}
				}
			}
		}
	}
	return rows;
}
