import { CalcInputError, requireFinite } from './errors';

export type LinearFit = {
	slope: number;
	intercept: number;
	slopeUncertainty: number;
	interceptUncertainty: number;
	/** Coefficient of determination, 1 − SS_res/SS_tot; 1 when y does not vary. */
	rSquared: number;
};

export type MeanWithTypeA = {
	mean: number;
	/** Experimental standard deviation of the mean, s(q̄) = s(q_k)/√n. */
	standardUncertainty: number;
	degreesOfFreedom: number;
};

function requireSamples(parameter: string, values: number[], minimum: number): number[] {
	if (!Array.isArray(values) || values.length < minimum) {
		throw new CalcInputError(
			parameter,
			`${Array.isArray(values) ? values.length : 0} values`,
			`at least ${minimum} values`
		);
	}
	values.forEach((v, k) => requireFinite(`${parameter}[${k}]`, v));
	return values;
}

/** Arithmetic mean; refuses values whose sum overflows rather than answer Infinity. */
export function finiteMean(parameter: string, values: readonly number[]): number {
	const mean = values.reduce((sum, v) => sum + v, 0) / values.length;
	if (!Number.isFinite(mean)) {
		throw new CalcInputError(parameter, 'values whose sum overflows', 'values small enough to sum');
	}
	return mean;
}

const sumOfSquaredDeviations = (values: readonly number[], mean: number) =>
	values.reduce((sum, v) => sum + (v - mean) ** 2, 0);

/**
 * Straight line y = intercept + slope·x by ordinary least squares, with the Type A standard
 * uncertainties of JCGM 100:2008 (GUM) Annex H.3: s² = Σ residual²/(n − 2),
 * u(slope) = s/√Sxx, u(intercept) = s·√(Σx²/(n·Sxx)), Sxx = Σ(x − x̄)² (the GUM's
 * D = n·Σx² − (Σx)² is n·Sxx; the centred sums lose fewer digits).
 */
export function linearFit(x: number[], y: number[]): LinearFit {
	requireSamples('x', x, 3);
	requireSamples('y', y, x.length);
	if (y.length !== x.length) {
		throw new CalcInputError('y', `${y.length} values`, `as many values as x (${x.length})`);
	}
	if (x.every((v) => v === x[0])) {
		throw new CalcInputError('x', `all ${x[0]}`, 'at least two different values');
	}
	const n = x.length;
	const xMean = finiteMean('x', x);
	const yMean = finiteMean('y', y);
	const sxx = sumOfSquaredDeviations(x, xMean);
	const ssTot = sumOfSquaredDeviations(y, yMean);
	const sumX2 = x.reduce((sum, v) => sum + v * v, 0);
	if (!Number.isFinite(sxx) || !Number.isFinite(sumX2)) {
		throw new CalcInputError('x', 'values whose squares overflow', 'values below about 1e150');
	}
	if (!Number.isFinite(ssTot)) {
		throw new CalcInputError('y', 'values whose squares overflow', 'values below about 1e150');
	}
	const sxy = x.reduce((sum, xk, k) => sum + (xk - xMean) * (y[k]! - yMean), 0);
	const slope = sxy / sxx;
	const intercept = yMean - slope * xMean;
	const ssRes = x.reduce((sum, xk, k) => sum + (y[k]! - intercept - slope * xk) ** 2, 0);
	const s = Math.sqrt(ssRes / (n - 2));
	return {
		slope,
		intercept,
		slopeUncertainty: s / Math.sqrt(sxx),
		interceptUncertainty: s * Math.sqrt(sumX2 / (n * sxx)),
		rSquared: y.every((v) => v === y[0]) ? 1 : 1 - ssRes / ssTot
	};
}

/**
 * Mean of repeated observations with its Type A standard uncertainty, JCGM 100:2008 (GUM)
 * 4.2.1–4.2.3: s²(q_k) = Σ(q_k − q̄)²/(n − 1), u(q̄) = s(q_k)/√n, ν = n − 1.
 */
export function meanWithTypeA(samples: number[]): MeanWithTypeA {
	requireSamples('samples', samples, 2);
	const n = samples.length;
	const mean = finiteMean('samples', samples);
	const variance = sumOfSquaredDeviations(samples, mean) / (n - 1);
	if (!Number.isFinite(variance)) {
		throw new CalcInputError(
			'samples',
			'values whose spread overflows',
			'values below about 1e150'
		);
	}
	return { mean, standardUncertainty: Math.sqrt(variance / n), degreesOfFreedom: n - 1 };
}
