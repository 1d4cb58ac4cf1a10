import type { AirState } from './air-state';
import {
	CalcInputError,
	requireFinite,
	requireNonNegative,
	requirePositive,
	requireWholeNumber
} from './errors';
import { finding, type Finding } from './findings';
import { dynamicPressure, INCOMPRESSIBLE_MACH_LIMIT, machNumber, reynoldsNumber } from './flow';
import { pascalsToMmH2O } from './units';

export const MAX_POINTS_PER_PLANE = 10_000;
export const MAX_MATRIX_POINTS = 250_000;

/** Probe positions in a traverse plane: rows at heights y, columns at lateral positions z. */
export type ProbeGrid = { y_m: number[]; z_m: number[] };

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

/** What holds at one tunnel speed, whatever the configuration, yaw or probe point. */
export type SpeedCondition = {
	speed_mps: number;
	modelRe: number;
	dynamicPressure_Pa: number;
	dynamicPressure_mmH2O: number;
	mach: number;
	correctedDynamicPressure_Pa: number;
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

export type UniformGridSpec = {
	rows: number;
	columns: number;
	rowSpacing_m: number;
	columnSpacing_m: number;
	firstRow_m?: number;
	firstColumn_m?: number;
};

/** A rectangular probe grid of evenly spaced rows and columns. */
export function uniformGrid(spec: UniformGridSpec): ProbeGrid {
	requireWholeNumber('rows', spec.rows, 1);
	requireWholeNumber('columns', spec.columns, 1);
	requirePositive('rowSpacing_m', spec.rowSpacing_m);
	requirePositive('columnSpacing_m', spec.columnSpacing_m);
	const y0 = requireFinite('firstRow_m', spec.firstRow_m ?? 0);
	const z0 = requireFinite('firstColumn_m', spec.firstColumn_m ?? 0);
	return {
		y_m: Array.from({ length: spec.rows }, (_, i) => y0 + i * spec.rowSpacing_m),
		z_m: Array.from({ length: spec.columns }, (_, j) => z0 + j * spec.columnSpacing_m)
	};
}

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

/** The flow quantities at each of the plan's speeds, in the plan's order. */
export function speedConditions(plan: MatrixPlan): SpeedCondition[] {
	const factor = plan.dynamicPressureFactor ?? 1;
	return plan.speeds_mps.map((speed_mps) => {
		const q = dynamicPressure(speed_mps, plan.tunnelAir);
		return {
			speed_mps,
			modelRe: reynoldsNumber(speed_mps, plan.modelReferenceLength_m, plan.tunnelAir),
			dynamicPressure_Pa: q,
			dynamicPressure_mmH2O: pascalsToMmH2O(q),
			mach: machNumber(speed_mps, plan.tunnelAir),
			correctedDynamicPressure_Pa: q * factor
		};
	});
}

/**
 * Expands the plan into one row per measured point, in run order: configuration, then yaw,
 * then speed, then plane, then repeat, then the plane's points row by row. Flow quantities
 * depend only on the speed, so each is computed once per speed and shared.
 */
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
								rows.push({
									speed_mps: condition.speed_mps,
									modelRe: condition.modelRe,
									dynamicPressure_Pa: condition.dynamicPressure_Pa,
									dynamicPressure_mmH2O: condition.dynamicPressure_mmH2O,
									mach: condition.mach,
									correctedDynamicPressure_Pa: condition.correctedDynamicPressure_Pa,
									point: point + 1,
									run,
									configurationId: configuration.id,
									yaw_deg,
									planeId: plane.id,
									downstream_m: plane.downstream_m,
									repeat,
									row: i + 1,
									column: j + 1,
									y_m: ys[i]!,
									z_m: zs[j]!
								});
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

/** The facility's limits a plan is checked against. */
export type FacilityEnvelope = {
	minSpeed_mps: number;
	maxSpeed_mps: number;
	maxDynamicPressure_Pa: number;
	yawMin_deg: number;
	yawMax_deg: number;
};

/** Findings for speeds, q, Mach and yaw against the facility's envelope. */
export function envelopeFindings(
	plan: MatrixPlan,
	envelope: FacilityEnvelope,
	conditions: SpeedCondition[] = speedConditions(plan)
): Finding[] {
	const notes: Finding[] = [];
	for (const c of conditions) {
		const v = c.speed_mps.toFixed(1);
		if (c.speed_mps > envelope.maxSpeed_mps) {
			notes.push(
				finding(
					'limit',
					'speed-above-envelope',
					`${v} m/s is above the facility's maximum of ${envelope.maxSpeed_mps} m/s.`,
					c.speed_mps
				)
			);
		} else if (c.speed_mps < envelope.minSpeed_mps) {
			notes.push(
				finding(
					'limit',
					'speed-below-envelope',
					`${v} m/s is below the facility's minimum of ${envelope.minSpeed_mps} m/s.`,
					c.speed_mps
				)
			);
		}
		// The facility's limit is on the q the tunnel is set to; the blockage-corrected q is what
		// the model feels, not what the fan and the structure see.
		if (c.dynamicPressure_Pa > envelope.maxDynamicPressure_Pa) {
			notes.push(
				finding(
					'limit',
					'q-above-envelope',
					`At ${v} m/s, q = ${c.dynamicPressure_Pa.toFixed(0)} Pa (as set, before blockage correction) is above the facility's maximum of ${envelope.maxDynamicPressure_Pa} Pa.`,
					c.speed_mps
				)
			);
		}
		if (c.mach > INCOMPRESSIBLE_MACH_LIMIT) {
			notes.push(
				finding(
					'limit',
					'mach-compressible',
					`At ${v} m/s the Mach number is ${c.mach.toFixed(2)}, above ${INCOMPRESSIBLE_MACH_LIMIT}.`,
					c.speed_mps
				)
			);
		}
	}
	for (const yaw of plan.yawAngles_deg) {
		if (yaw < envelope.yawMin_deg || yaw > envelope.yawMax_deg) {
			notes.push(
				finding(
					'limit',
					'yaw-outside-turntable',
					`Yaw ${yaw}° is outside the turntable's ${envelope.yawMin_deg}° to ${envelope.yawMax_deg}°.`
				)
			);
		}
	}
	return notes;
}
