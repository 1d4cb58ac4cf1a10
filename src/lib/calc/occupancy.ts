import { requireNonNegative } from './errors';
import { matrixSize, validatePlan, type MatrixPlan } from './matrix';

/** A facility's planning times; values are the facility's settings, never constants here. */
export type FacilityTiming = {
	/** After each speed is set, before readings start. */
	settling_s: number;
	/** Moving the traverse to each point. */
	traverseMove_s: number;
	/** Each turn of the turntable to a new yaw angle. */
	yawChange_s: number;
	/** Each change from one configuration to the next. */
	modelChange_s: number;
	setUp_s: number;
	tearDown_s: number;
};

export type Occupancy = {
	total_s: number;
	breakdown: {
		setUpAndTearDown_s: number;
		modelChanges_s: number;
		yawChanges_s: number;
		settling_s: number;
		traverseMoves_s: number;
		dwell_s: number;
	};
	counts: {
		runs: number;
		points: number;
		modelChanges: number;
		yawChanges: number;
		speedSettings: number;
	};
};

/**
 * Tunnel occupancy for the plan in run order (see expandMatrix): one model change between
 * configurations, one yaw change between yaw angles within a configuration, settling after
 * every speed is set (the flow must settle again after a yaw or model change), and a traverse
 * move and a dwell at every point.
 */
export function estimateOccupancy(plan: MatrixPlan, facility: FacilityTiming): Occupancy {
	validatePlan(plan);
	for (const [key, value] of Object.entries(facility)) requireNonNegative(`facility.${key}`, value);
	const C = plan.configurations.length;
	const Y = plan.yawAngles_deg.length;
	const S = plan.speeds_mps.length;
	const points = matrixSize(plan);
	const counts = {
		runs: C * Y * S * plan.planes.length * plan.repeats,
		points,
		modelChanges: C - 1,
		yawChanges: C * (Y - 1),
		speedSettings: C * Y * S
	};
	const breakdown = {
		setUpAndTearDown_s: facility.setUp_s + facility.tearDown_s,
		modelChanges_s: counts.modelChanges * facility.modelChange_s,
		yawChanges_s: counts.yawChanges * facility.yawChange_s,
		settling_s: counts.speedSettings * facility.settling_s,
		traverseMoves_s: points * facility.traverseMove_s,
		dwell_s: points * plan.dwellPerPoint_s
	};
	const total_s = Object.values(breakdown).reduce((a, b) => a + b, 0);
	return { total_s, breakdown, counts };
}
