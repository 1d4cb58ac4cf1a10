import {
	requireFinite,
	requireInRange,
	requireNonNegative,
	requirePositive,
	requireWholeNumber
} from './errors';

export type MeanCpUncertaintyInput = {
	/** Mean Cp of the readings. */
	cp: number;
	/** How many readings the mean is of; their scatter is taken as independent. */
	readings: number;
	dynamicPressure_Pa: number;
	readingUncertainty_Pa: number;
	/** Standard uncertainty of q as a fraction of q. */
	relativeDynamicPressureUncertainty: number;
};

/**
 * Standard uncertainty of a mean Cp = p̄/q over n readings against one reference q:
 * JCGM 100:2008 eq. 10 with the sensitivities of a quotient in closed form, c_p̄ = 1/q and
 * c_q = −Cp/q, and u(p̄) = u_p/√n. The q term does not shrink with n: every point shares q.
 * Closed form because a reduction asks it for every row and column of every traverse; the
 * tests hold it to propagateUncertainty.
 */
export function meanCpUncertainty(x: MeanCpUncertaintyInput): number {
	const cp = requireFinite('cp', x.cp);
	const n = requireWholeNumber('readings', x.readings, 1);
	const q = requirePositive('dynamicPressure_Pa', x.dynamicPressure_Pa);
	const uP = requireNonNegative('readingUncertainty_Pa', x.readingUncertainty_Pa);
	const uQ = requireNonNegative(
		'relativeDynamicPressureUncertainty',
		x.relativeDynamicPressureUncertainty
	);
	return Math.hypot(uP / Math.sqrt(n) / q, cp * uQ);
}

export type CpDifferenceUncertaintyInput = {
	variantCp: number;
	baselineCp: number;
	/** Readings matched in both, each mean over this many. */
	readings: number;
	variantDynamicPressure_Pa: number;
	baselineDynamicPressure_Pa: number;
	readingUncertainty_Pa: number;
	relativeDynamicPressureUncertainty: number;
	/** Correlation of the two runs' q errors: 1 when both come from one reference instrument. */
	dynamicPressureCorrelation: number;
};

/**
 * Standard uncertainty of ΔCp = p̄_v/q_v − p̄_b/q_b: JCGM 100:2008 eq. 13 with closed-form
 * sensitivities. With relative q uncertainty ε the q terms are ε²(Cp_v² + Cp_b² − 2r·Cp_v·Cp_b),
 * so a fully shared reference (r = 1) leaves ε·|Cp_v − Cp_b| instead of adding twice.
 */
export function cpDifferenceUncertainty(x: CpDifferenceUncertaintyInput): number {
	const cpV = requireFinite('variantCp', x.variantCp);
	const cpB = requireFinite('baselineCp', x.baselineCp);
	const n = requireWholeNumber('readings', x.readings, 1);
	const qV = requirePositive('variantDynamicPressure_Pa', x.variantDynamicPressure_Pa);
	const qB = requirePositive('baselineDynamicPressure_Pa', x.baselineDynamicPressure_Pa);
	const uP = requireNonNegative('readingUncertainty_Pa', x.readingUncertainty_Pa) / Math.sqrt(n);
	const e = requireNonNegative(
		'relativeDynamicPressureUncertainty',
		x.relativeDynamicPressureUncertainty
	);
	const r = requireInRange('dynamicPressureCorrelation', x.dynamicPressureCorrelation, -1, 1);
	const readings = (uP / qV) ** 2 + (uP / qB) ** 2;
	const reference = e * e * (cpV * cpV + cpB * cpB - 2 * r * cpV * cpB);
	return Math.sqrt(readings + Math.max(reference, 0));
}
