import type { AirState } from './air-state';
import { requireInRange, requirePositive } from './errors';
import { finding, type Finding } from './findings';
import { INCOMPRESSIBLE_MACH_LIMIT, machNumber, reynoldsNumber } from './flow';

export type SimilarityInput = {
	/** Model length over full-scale length, e.g. 1/5. */
	scale: number;
	fullScaleLength_m: number;
	fullScaleSpeed_mps: number;
	modelSpeed_mps: number;
	fullScaleAir: AirState;
	tunnelAir: AirState;
	/** Model Re above which the coefficients of interest no longer change; none if unknown. */
	reIndependenceThreshold?: number;
};

export type Similarity = {
	modelRe: number;
	fullScaleRe: number;
	reRatio: number;
	speedForEqualRe_mps: number;
	machAtEqualRe: number;
	modelMach: number;
	notes: Finding[];
};

const sig = (x: number, digits = 3) => x.toPrecision(digits);

/**
 * Dynamic similarity of a scale model against full scale. The speed for equal Re is
 * V_model = V_full·(L_full/L_model)·(ν_model/ν_full).
 */
export function similarity(x: SimilarityInput): Similarity {
	// Below 1:100 000 no tunnel model is meaningful, and the equal-Re speed would overflow.
	const scale = requireInRange('scale', x.scale, 1e-5, 1);
	requirePositive('fullScaleLength_m', x.fullScaleLength_m);
	requirePositive('fullScaleSpeed_mps', x.fullScaleSpeed_mps);
	requirePositive('modelSpeed_mps', x.modelSpeed_mps);
	const modelLength_m = scale * x.fullScaleLength_m;

	const modelRe = reynoldsNumber(x.modelSpeed_mps, modelLength_m, x.tunnelAir);
	const fullScaleRe = reynoldsNumber(x.fullScaleSpeed_mps, x.fullScaleLength_m, x.fullScaleAir);
	const speedForEqualRe_mps =
		x.fullScaleSpeed_mps *
		(1 / scale) *
		(x.tunnelAir.kinematicViscosity_m2s / x.fullScaleAir.kinematicViscosity_m2s);
	const machAtEqualRe = machNumber(speedForEqualRe_mps, x.tunnelAir);
	const modelMach = machNumber(x.modelSpeed_mps, x.tunnelAir);
	const reRatio = modelRe / fullScaleRe;

	const notes: Finding[] = [];
	if (modelMach > INCOMPRESSIBLE_MACH_LIMIT) {
		notes.push(
			finding(
				'limit',
				'mach-compressible',
				`Model Mach number ${sig(modelMach, 2)} is above ${INCOMPRESSIBLE_MACH_LIMIT}: compressibility is no longer negligible.`
			)
		);
	}
	if (reRatio < 0.999) {
		notes.push(
			finding(
				machAtEqualRe > INCOMPRESSIBLE_MACH_LIMIT ? 'caution' : 'info',
				're-gap',
				`Model Re is ${sig(reRatio * 100, 2)} % of full scale. Equal Re needs ${sig(speedForEqualRe_mps)} m/s` +
					(machAtEqualRe > INCOMPRESSIBLE_MACH_LIMIT
						? ` (Mach ${sig(machAtEqualRe, 2)}), beyond incompressible flow; argue Re-independence from a speed sweep instead.`
						: '.')
			)
		);
	}
	if (x.reIndependenceThreshold !== undefined) {
		const threshold = requirePositive('reIndependenceThreshold', x.reIndependenceThreshold);
		if (modelRe < threshold) {
			notes.push(
				finding(
					'caution',
					're-below-independence',
					`Model Re ${sig(modelRe)} is below the stated Re-independence threshold ${sig(threshold)}.`
				)
			);
		}
	}
	return { modelRe, fullScaleRe, reRatio, speedForEqualRe_mps, machAtEqualRe, modelMach, notes };
}
