import { CalcInputError, requireFinite, requireNonNegative, requirePositive } from './errors';

export type ReynoldsPoint = { re: number; value: number };

export type ReynoldsSweep = {
	/** (v[i+1] − v[i])/v[i] between neighbouring points in order of Re. */
	relativeChanges: number[];
	/** Lowest Re from which every following change stays within the tolerance; null if none. */
	independentFromRe: number | null;
};

/**
 * Reynolds-number dependence of a measured coefficient: the relative change between neighbouring
 * Reynolds numbers, and the lowest Re above which it stays within the tolerance, the usual test
 * for Re-independence (common practice, no source). The value at each Re but the highest divides
 * a change, so it must not be zero.
 */
export function reynoldsSweep(points: ReynoldsPoint[], tolerance: number): ReynoldsSweep {
	requireNonNegative('tolerance', tolerance);
	if (!Array.isArray(points)) throw new CalcInputError('points', String(points), 'an array');
	points.forEach((p, k) => {
		requirePositive(`points[${k}].re`, p.re);
		requireFinite(`points[${k}].value`, p.value);
	});
	const sorted = points.map((p, k) => ({ ...p, k })).sort((a, b) => a.re - b.re);

	const relativeChanges = sorted.slice(1).map((next, i) => {
		const previous = sorted[i]!;
		if (next.re === previous.re) {
			throw new CalcInputError(
				`points[${next.k}].re`,
				next.re,
				`a Reynolds number not already given (points[${previous.k}]); average repeats first`
			);
		}
		if (previous.value === 0) {
			throw new CalcInputError(
				`points[${previous.k}].value`,
				0,
				'non-zero: the change to the next Re is relative to it'
			);
		}
		const change = (next.value - previous.value) / previous.value;
		if (!Number.isFinite(change)) {
			throw new CalcInputError(
				`points[${previous.k}].value`,
				previous.value,
				'large enough for a finite relative change'
			);
		}
		return change;
	});

	let independentFromRe: number | null = null;
	for (let i = relativeChanges.length - 1; i >= 0; i--) {
		if (Math.abs(relativeChanges[i]!) > tolerance) break;
		independentFromRe = sorted[i]!.re;
	}
	return { relativeChanges, independentFromRe };
}
