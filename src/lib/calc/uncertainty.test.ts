import { describe, expect, it } from 'vitest';
import { CalcInputError, pitotSpeed, propagateUncertainty } from './index';

describe('propagateUncertainty (JCGM 100:2008, eq. 10)', () => {
	it('matches the pitot-speed check value', () => {
		// JCGM 100:2008 eq. 10, evaluated by hand: V = √(2Δp/ρ), Δp = 250 ± 2 Pa,
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

describe('propagateUncertainty with correlated inputs (JCGM 100:2008, eq. 13)', () => {
	const pair = [
		{ name: 'x1', value: 101.3, standardUncertainty: 0.4 },
		{ name: 'x2', value: 99.8, standardUncertainty: 0.4 }
	];
	const difference = (x: Record<string, number>) => x.x1! - x.x2!;

	it('cancels a fully correlated difference and adds an uncorrelated one in quadrature', () => {
		// GUM eq. 13 with c1 = 1, c2 = −1 and u1 = u2 = u: u_c² = 2u² − 2u²·r, so r = 1 gives 0,
		// r = 0 gives u·√2 (eq. 10), r = −1 gives 2u.
		const correlated = (r: number) =>
			propagateUncertainty(difference, pair, { correlations: [{ a: 'x1', b: 'x2', r }] });
		expect(correlated(1).standardUncertainty).toBeCloseTo(0, 6);
		expect(correlated(0).standardUncertainty).toBeCloseTo(0.4 * Math.SQRT2, 9);
		expect(correlated(-1).standardUncertainty).toBeCloseTo(0.8, 9);
		expect(propagateUncertainty(difference, pair).standardUncertainty).toBeCloseTo(
			0.4 * Math.SQRT2,
			9
		);
		for (const c of correlated(1).contributions) expect(c.varianceShare).toBeCloseTo(0.5, 9);
	});

	it('reproduces the resistance and reactance of GUM Annex H.2', () => {
		// JCGM 100:2008 Annex H.2: V = 4.999 V ± 3.2 mV, I = 19.661 mA ± 9.5 µA,
		// φ = 1.04446 rad ± 0.75 mrad, r(V, I) = −0.36, r(V, φ) = 0.86, r(I, φ) = −0.65.
		// Results from these inputs as published in the GTC documentation (MSLNZ/GTC
		// docs/API/GUM_H2.rst, read for this test): R = 127.732(70) Ω, X = 219.85(30) Ω,
		// Z = 254.26(24) Ω; the GUM's Table H.3 gives 0.071, 0.295 and 0.236 Ω (from memory).
		const inputs = [
			{ name: 'V', value: 4.999, standardUncertainty: 3.2e-3 },
			{ name: 'I', value: 19.661e-3, standardUncertainty: 9.5e-6 },
			{ name: 'phi', value: 1.04446, standardUncertainty: 7.5e-4 }
		];
		const correlations = [
			{ a: 'V', b: 'I', r: -0.36 },
			{ a: 'V', b: 'phi', r: 0.86 },
			{ a: 'I', b: 'phi', r: -0.65 }
		];
		const R = propagateUncertainty((x) => (x.V! * Math.cos(x.phi!)) / x.I!, inputs, {
			correlations
		});
		const X = propagateUncertainty((x) => (x.V! * Math.sin(x.phi!)) / x.I!, inputs, {
			correlations
		});
		const Z = propagateUncertainty((x) => x.V! / x.I!, inputs, { correlations });
		expect(R.value).toBeCloseTo(127.732, 3);
		expect(R.standardUncertainty).toBeCloseTo(0.07, 3);
		expect(X.value).toBeCloseTo(219.85, 2);
		expect(X.standardUncertainty).toBeCloseTo(0.3, 2);
		expect(Z.value).toBeCloseTo(254.26, 2);
		expect(Z.standardUncertainty).toBeCloseTo(0.24, 2);
		expect(R.contributions.reduce((s, c) => s + c.varianceShare, 0)).toBeCloseTo(1, 12);
	});

	it.each([
		[[{ a: 'x1', b: 'x3', r: 0.5 }], /correlations\[0\]\.b = x3/],
		[[{ a: 'x1', b: 'x1', r: 0.5 }], /an input other than x1/],
		[[{ a: 'x1', b: 'x2', r: 1.2 }], /correlations\[0\]\.r = 1.2/],
		[[{ a: 'x1', b: 'x2', r: Number.NaN }], /correlations\[0\]\.r = NaN/],
		[
			[
				{ a: 'x1', b: 'x2', r: 0.5 },
				{ a: 'x2', b: 'x1', r: 0.5 }
			],
			/each pair of inputs once/
		]
	])('refuses correlations %j', (correlations, message) => {
		expect(() => propagateUncertainty(difference, pair, { correlations })).toThrow(CalcInputError);
		expect(() => propagateUncertainty(difference, pair, { correlations })).toThrow(message);
	});

	it('refuses correlations that cannot hold together', () => {
		// Three inputs cannot all be perfectly anti-correlated with each other: the matrix is not
		// positive semi-definite and GUM eq. 13 would give u_c² = 3u² − 6u² < 0.
		const inputs = ['a', 'b', 'c'].map((name) => ({ name, value: 1, standardUncertainty: 1 }));
		expect(() =>
			propagateUncertainty((x) => x.a! + x.b! + x.c!, inputs, {
				correlations: [
					{ a: 'a', b: 'b', r: -1 },
					{ a: 'a', b: 'c', r: -1 },
					{ a: 'b', b: 'c', r: -1 }
				]
			})
		).toThrow(/positive semi-definite/);
	});
});
