import {
	blockage,
	envelopeFindings,
	estimateOccupancy,
	matrixRows,
	matrixSize,
	speedConditions,
	type Blockage,
	type MatrixPlan
} from '../calc';
import type { BlockageRequest, MatrixRequest } from '../schemas/calc';

/** Blockage from a parsed API request (SI values already). */
export function blockageFromRequest(req: BlockageRequest): Blockage {
	return blockage({
		method: req.method,
		frontalArea_m2: req.frontalArea,
		section: {
			kind: req.section.kind,
			width_m: req.section.width,
			height_m: req.section.height,
			cornerFillet_m: req.section.cornerFillet
		},
		dragCoefficient: req.dragCoefficient,
		modelVolume_m3: req.modelVolume,
		modelLength_m: req.modelLength,
		limits: req.limits,
		bodyShapeFactor: req.bodyShapeFactor,
		tunnelShapeFactor: req.tunnelShapeFactor
	});
}

/**
 * Expands a matrix request: one page of rows, the per-speed conditions, the blockage applied to
 * q, the findings against the envelope, and the occupancy when facility times are given.
 */
export function evaluateMatrixRequest(req: MatrixRequest) {
	const correction = req.blockage ? blockageFromRequest(req.blockage) : undefined;
	const plan: MatrixPlan = {
		configurations: req.configurations,
		speeds_mps: req.speeds,
		yawAngles_deg: req.yawAngles_deg,
		planes: req.planes.map((p) => ({ id: p.id, downstream_m: p.downstream, grid: p.grid })),
		dwellPerPoint_s: req.dwellPerPoint,
		repeats: req.repeats,
		modelReferenceLength_m: req.modelReferenceLength,
		tunnelAir: req.tunnelAir,
		dynamicPressureFactor: correction?.dynamicPressureFactor ?? 1
	};
	const rows = matrixRows(plan, req.offset, req.limit);
	const speeds = speedConditions(plan);
	const findings = [
		...(correction?.notes ?? []),
		...(req.envelope
			? envelopeFindings(plan.yawAngles_deg, speeds, {
					minSpeed_mps: req.envelope.minSpeed,
					maxSpeed_mps: req.envelope.maxSpeed,
					maxDynamicPressure_Pa: req.envelope.maxDynamicPressure,
					yawMin_deg: req.envelope.yawMin_deg,
					yawMax_deg: req.envelope.yawMax_deg
				})
			: [])
	];
	const occupancy = req.timing
		? estimateOccupancy(plan, {
				settling_s: req.timing.settling,
				traverseMove_s: req.timing.traverseMove,
				yawChange_s: req.timing.yawChange,
				modelChange_s: req.timing.modelChange,
				setUp_s: req.timing.setUp,
				tearDown_s: req.timing.tearDown
			})
		: null;
	return {
		rowCount: matrixSize(plan),
		offset: req.offset,
		limit: req.limit,
		rows,
		speeds,
		blockage: correction ?? null,
		findings,
		occupancy
	};
}
