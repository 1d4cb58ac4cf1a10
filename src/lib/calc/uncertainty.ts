import { CalcInputError, requireFinite, requireNonNegative } from './errors';

export type UncertainInput = { name: string; value: number; standardUncertainty: number };

export type UncertaintyBudget = {
	value: number;
	standardUncertainty: number;
	contributions: {
		name: string;
		/** ∂f/∂x_i at the input values. */
		sensitivityCoefficient: number;
		/** |∂f/∂x_i|·u(x_i), in the output's unit. */
		uncertaintyContribution: number;
		/** Share of the combined variance, 0..1. */
		varianceShare: number;
	}[];
};

/**
 * First-order propagation of uncorrelated standard uncertainties, JCGM 100:2008 (GUM) eq. 10:
 * u_c²(y) = Σ (∂f/∂x_i)²·u²(x_i). Sensitivities by central differences with a step well
 * inside each input's uncertainty.
 */
export function propagateUncertainty(
	f: (x: Record<string, number>) => number,
	inputs: UncertainInput[]
): UncertaintyBudget {
	if (inputs.length === 0) throw new CalcInputError('inputs', '[]', 'at least one input');
	const point: Record<string, number> = {};
	for (const input of inputs) {
		if (input.name in point)
			throw new CalcInputError('inputs.name', input.name, 'names that each appear once');
		point[input.name] = requireFinite(`${input.name}.value`, input.value);
		requireNonNegative(`${input.name}.standardUncertainty`, input.standardUncertainty);
	}
	const value = f({ ...point });
	if (!Number.isFinite(value))
		throw new CalcInputError('f(inputs)', value, 'a finite value at the inputs');

	const partials = inputs.map(({ name, value: x, standardUncertainty: u }) => {
		const step = Math.max(u * 1e-3, Math.abs(x) * 1e-9, 1e-12);
		const up = f({ ...point, [name]: x + step });
		const down = f({ ...point, [name]: x - step });
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
	const variance = partials.reduce((sum, p) => sum + p.uncertaintyContribution ** 2, 0);
	return {
		value,
		standardUncertainty: Math.sqrt(variance),
		contributions: partials.map((p) => ({
			...p,
			varianceShare: variance > 0 ? p.uncertaintyContribution ** 2 / variance : 0
		}))
	};
}
