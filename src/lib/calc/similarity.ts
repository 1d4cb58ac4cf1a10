import type { AirState } from './air-state';
import { requireInRange, requirePositive } from './errors';
import { finding, type Finding } from './findings';
import { INCOMPRESSIBLE_MACH_LIMIT, machNumber, reynoldsNumber } from './flow';
import { DEFAULT_RE_INDEPENDENCE } from './kinds';

const BUILDING = DEFAULT_RE_INDEPENDENCE.building!;

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
/** Three significant figures without an exponent: 12500, not 1.25e+4. */
const speed = (v: number) => String(+v.toPrecision(3));

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
	// A derived figure, never refused however large: a 1:500 building model needs thousands of
	// m/s for equal Re, and saying so is the point.
	const machAtEqualRe =
		speedForEqualRe_mps /
		requirePositive('tunnelAir.speedOfSound_mps', x.tunnelAir.speedOfSound_mps);
	const modelMach = machNumber(x.modelSpeed_mps, x.tunnelAir);
	const reRatio = modelRe / fullScaleRe;

	const notes: Finding[] = [];
	const at = x.modelSpeed_mps;
	if (modelMach > INCOMPRESSIBLE_MACH_LIMIT) {
		notes.push(
			finding(
				'limit',
				'mach-compressible',
				`Model Mach number ${sig(modelMach, 2)} is above ${INCOMPRESSIBLE_MACH_LIMIT}: compressibility is no longer negligible.`,
				at
			)
		);
	}
	if (reRatio < 0.999) {
		const unreachable = machAtEqualRe > INCOMPRESSIBLE_MACH_LIMIT;
		notes.push(
			finding(
				unreachable ? 'limit' : 'info',
				unreachable ? 'equal-re-unreachable' : 're-gap',
				`Model Re is ${sig(reRatio * 100, 2)} % of full scale. Equal Re needs ${speed(speedForEqualRe_mps)} m/s` +
					(unreachable
						? ` (Mach ${sig(machAtEqualRe, 2)}): out of reach in a low-speed tunnel. Argue Re-independence from a speed sweep instead (sharp-edged bodies such as buildings are commonly taken as Re-independent above a height-based Re of about ${BUILDING.threshold.toExponential(1).replace('e+', 'e')}, ${BUILDING.source}).`
						: '.'),
				at
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
					`Model Re ${sig(modelRe)} is below the stated Re-independence threshold ${sig(threshold)}.`,
					at
				)
			);
		}
	}
	return { modelRe, fullScaleRe, reRatio, speedForEqualRe_mps, machAtEqualRe, modelMach, notes };
}
