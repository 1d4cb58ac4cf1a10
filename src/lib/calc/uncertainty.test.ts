import { describe, expect, it } from 'vitest';
import { CalcInputError, pitotSpeed, propagateUncertainty } from './index';

describe('propagateUncertainty (JCGM 100:2008, eq. 10)', () => {
	it('matches the pitot-speed check value', () => {
		// Domain primer §7 [computed from GUM eq. 10]: V = √(2Δp/ρ), Δp = 250 ± 2 Pa,
		// ρ = 1.2041 ± 0.003 kg/m³ → V = 20.378 m/s, u_c = 0.085 m/s.
		const budget = propagateUncertainty(
			(x) => pitotSpeed(x.dp!, x.rho!),
			[
				{ name: 'dp', value: 250, standardUncertainty: 2 },
				{ name: 'rho', value: 1.2041, standardUncertainty: 0.003 }
			]
		);
		expect(budget.value).toBeCloseTo(20.378, 3);
		expect(budget.standardUncertainty).toBeCloseTo(0.085, 3);
		expect(budget.contributions.reduce((s, c) => s + c.varianceShare, 0)).toBeCloseTo(1, 12);
	});

	it('agrees with the relative form for a product of powers', () => {
		// GUM eq. 12: y = c·Π x_i^p_i → (u_c/y)² = Σ (p_i·u(x_i)/x_i)².
		const budget = propagateUncertainty(
			(x) => 3 * x.a! ** 2 * x.b! ** -0.5,
			[
				{ name: 'a', value: 2, standardUncertainty: 0.02 },
				{ name: 'b', value: 9, standardUncertainty: 0.27 }
			]
		);
		const relative = Math.hypot(2 * (0.02 / 2), -0.5 * (0.27 / 9));
		expect(budget.standardUncertainty / budget.value).toBeCloseTo(relative, 8);
		expect(budget.contributions[0]!.sensitivityCoefficient).toBeCloseTo(6 * 2 * 9 ** -0.5, 6);
	});

	it('gives a zero contribution for an exact input', () => {
		const budget = propagateUncertainty(
			(x) => x.a! * x.b!,
			[
				{ name: 'a', value: 2, standardUncertainty: 0 },
				{ name: 'b', value: 5, standardUncertainty: 0.1 }
			]
		);
		expect(budget.contributions[0]!.uncertaintyContribution).toBe(0);
		expect(budget.standardUncertainty).toBeCloseTo(0.2, 9);
	});

	it.each([
		[[], /inputs/],
		[[{ name: 'a', value: 1, standardUncertainty: -1 }], /a.standardUncertainty = -1/],
		[[{ name: 'a', value: NaN, standardUncertainty: 1 }], /a.value = NaN/],
		[
			[
				{ name: 'a', value: 1, standardUncertainty: 1 },
				{ name: 'a', value: 2, standardUncertainty: 1 }
			],
			/each appear once/
		]
	])('refuses %j', (inputs, message) => {
		expect(() => propagateUncertainty((x) => x.a ?? 0, inputs)).toThrow(CalcInputError);
		expect(() => propagateUncertainty((x) => x.a ?? 0, inputs)).toThrow(message);
	});

	it('refuses a function that is not finite at the inputs', () => {
		expect(() =>
			propagateUncertainty((x) => 1 / x.a!, [{ name: 'a', value: 0, standardUncertainty: 0.1 }])
		).toThrow(CalcInputError);
	});
});
