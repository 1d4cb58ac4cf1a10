import { CalcInputError, requireFinite, requireInRange, requireNonNegative } from './errors';

export type UncertainInput = { name: string; value: number; standardUncertainty: number };

/** Correlation coefficient r(a, b) between two inputs' estimates, −1..1. */
export type InputCorrelation = { a: string; b: string; r: number };

export type PropagationOptions = { correlations?: InputCorrelation[] };

export type UncertaintyBudget = {
	value: number;
	standardUncertainty: number;
	contributions: {
		name: string;
		/** ∂f/∂x_i at the input values. */
		sensitivityCoefficient: number;
		/** |∂f/∂x_i|·u(x_i), in the output's unit. */
		uncertaintyContribution: number;
		/**
		 * Share of Σ(∂f/∂x_i·u(x_i))², 0..1. Without correlations that sum is the combined
		 * variance; with them it is only its uncorrelated part, as the cross terms belong to pairs.
		 */
		varianceShare: number;
	}[];
};

// A correlation matrix that is not positive semi-definite can drive the variance below zero;
// rounding alone stays within this share of the uncorrelated sum.
const ROUNDING_SHARE = 1e-9;

function requireCorrelations(
	correlations: InputCorrelation[],
	names: Set<string>
): InputCorrelation[] {
	const pairs = new Set<string>();
	correlations.forEach(({ a, b, r }, k) => {
		if (!names.has(a)) throw new CalcInputError(`correlations[${k}].a`, a, 'the name of an input');
		if (!names.has(b)) throw new CalcInputError(`correlations[${k}].b`, b, 'the name of an input');
		if (a === b) throw new CalcInputError(`correlations[${k}].b`, b, `an input other than ${a}`);
		requireInRange(`correlations[${k}].r`, r, -1, 1);
		const pair = JSON.stringify([a, b].sort());
		if (pairs.has(pair)) {
			throw new CalcInputError(`correlations[${k}]`, `${a}, ${b}`, 'each pair of inputs once');
		}
		pairs.add(pair);
	});
	return correlations;
}

/**
 * First-order propagation of standard uncertainties, JCGM 100:2008 (GUM) eq. 13:
 * u_c²(y) = Σ c_i²·u²(x_i) + 2·Σ_{i<j} c_i·c_j·u(x_i)·u(x_j)·r(x_i, x_j), c_i = ∂f/∂x_i;
 * with no correlations given it is eq. 10. Sensitivities by central differences with a step well
 * inside each input's uncertainty.
 */
export function propagateUncertainty(
	f: (x: Record<string, number>) => number,
	inputs: UncertainInput[],
	options: PropagationOptions = {}
): UncertaintyBudget {
	if (inputs.length === 0) throw new CalcInputError('inputs', '[]', 'at least one input');
	const point: Record<string, number> = {};
	for (const input of inputs) {
		if (input.name in point)
			throw new CalcInputError('inputs.name', input.name, 'names that each appear once');
		point[input.name] = requireFinite(`${input.name}.value`, input.value);
		requireNonNegative(`${input.name}.standardUncertainty`, input.standardUncertainty);
	}
	const correlations = requireCorrelations(options.correlations ?? [], new Set(Object.keys(point)));
	const value = f({ ...point });
	if (!Number.isFinite(value))
		throw new CalcInputError('f(inputs)', value, 'a finite value at the inputs');

	// One working copy of the inputs, each nudged and put back in turn: reductions call this
	// thousands of times, so no copy per evaluation. f must not keep its argument.
	const work = { ...point };
	const partials = inputs.map(({ name, value: x, standardUncertainty: u }) => {
		const step = Math.max(u * 1e-3, Math.abs(x) * 1e-9, 1e-12);
		work[name] = x + step;
		const up = f(work);
		work[name] = x - step;
		const down = f(work);
		work[name] = x;
		const sensitivityCoefficient = (up - down) / (2 * step);
		if (!Number.isFinite(sensitivityCoefficient)) {
			throw new CalcInputError(`${name}.value`, x, 'a point where f is differentiable');
		}
		return {
			name,
			sensitivityCoefficient,
			uncertaintyContribution: Math.abs(sensitivityCoefficient) * u
		};
	});
	const uncorrelated = partials.reduce((sum, p) => sum + p.uncertaintyContribution ** 2, 0);
	const signed = new Map(
		partials.map((p, i) => [p.name, p.sensitivityCoefficient * inputs[i]!.standardUncertainty])
	);
	const crossTerms = correlations.reduce(
		(sum, { a, b, r }) => sum + 2 * signed.get(a)! * signed.get(b)! * r,
		0
	);
	const variance = uncorrelated + crossTerms;
	if (variance < -ROUNDING_SHARE * uncorrelated) {
		throw new CalcInputError(
			'correlations',
			`a combined variance of ${variance}`,
			'correlations that can occur together (a positive semi-definite matrix)'
		);
	}
	return {
		value,
		standardUncertainty: Math.sqrt(Math.max(variance, 0)),
		contributions: partials.map((p) => ({
			...p,
			varianceShare: uncorrelated > 0 ? p.uncertaintyContribution ** 2 / uncorrelated : 0
		}))
	};
}
