import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CalcInputError, linearFit, meanWithTypeA } from './index';

describe('linearFit (JCGM 100:2008 Annex H.3)', () => {
	it('reproduces the GUM thermometer calibration', () => {
		// JCGM 100:2008 Annex H.3, the thermometer calibration: readings t_k and corrections b_k,
		// fitted as b = y1 + y2·(t − t0) with t0 = 20 °C; published y1 = −0.1712 °C,
		// u(y1) = 0.0029 °C, y2 = 0.00218, u(y2) = 0.00067 (from memory; the same data and
		// results, -0.1712(29) and 0.00218(67), are reproduced in the GTC documentation,
		// MSLNZ/GTC docs/API/GUM_H3.rst, read for this test).
		const t_degC = [
			21.521, 22.012, 22.512, 23.003, 23.507, 23.999, 24.513, 25.002, 25.503, 26.01, 26.511
		];
		const b_degC = [
			-0.171, -0.169, -0.166, -0.159, -0.164, -0.165, -0.156, -0.157, -0.159, -0.161, -0.16
		];
		const fit = linearFit(
			t_degC.map((t) => t - 20),
			b_degC
		);
		expect(fit.intercept).toBeCloseTo(-0.1712, 4);
		expect(fit.interceptUncertainty).toBeCloseTo(0.0029, 4);
		expect(fit.slope).toBeCloseTo(0.00218, 5);
		expect(fit.slopeUncertainty).toBeCloseTo(0.00067, 5);
		// GTC documentation, same page: sum of the squared residuals 0.000110096583109, so
		// s = √(SS_res/9) = 0.0035 °C as the GUM gives (from memory). SS_res = (1 − R²)·SS_tot,
		// and SS_tot evaluated by hand from the b_k is 2.407 27e-4 °C².
		expect((1 - fit.rSquared) * 2.4072727e-4).toBeCloseTo(0.000110096583109, 9);
	});

	it('returns the line itself, with no uncertainty, for points exactly on it', () => {
		// Least squares reproduces an exact line (GUM Annex H.3: every residual is zero, so s = 0).
		fc.assert(
			fc.property(
				fc.uniqueArray(fc.integer({ min: -1000, max: 1000 }), { minLength: 3, maxLength: 20 }),
				fc.integer({ min: -100, max: 100 }),
				fc.integer({ min: -100, max: 100 }),
				(x, slope, intercept) => {
					const fit = linearFit(
						x,
						x.map((xk) => intercept + slope * xk)
					);
					expect(fit.slope).toBeCloseTo(slope, 9);
					expect(fit.intercept).toBeCloseTo(intercept, 7);
					expect(fit.slopeUncertainty).toBeCloseTo(0, 9);
					expect(fit.interceptUncertainty).toBeCloseTo(0, 7);
					expect(fit.rSquared).toBeCloseTo(1, 9);
				}
			)
		);
	});

	it('gives R² = 1 for a flat line', () => {
		// SS_tot = 0: the coefficient of determination is taken as 1 (common practice, no source).
		expect(linearFit([1, 2, 3], [0.1, 0.1, 0.1]).rSquared).toBe(1);
	});

	it.each([
		[[1, 2], [1, 2], /x = 2 values/],
		[[1, 2, 3], [1, 2], /y = 2 values/],
		[[1, 2, 3], [1, 2, 3, 4], /as many values as x/],
		[[2, 2, 2], [1, 2, 3], /at least two different values/],
		[[1, Number.NaN, 3], [1, 2, 3], /x\[1\] = NaN/],
		[[1, 2, 3], [1, 2, Number.POSITIVE_INFINITY], /y\[2\] = Infinity/],
		[[1e200, 2e200, 3e200], [1, 2, 3], /x = values whose squares overflow/]
	])('refuses x = %j, y = %j', (x, y, message) => {
		expect(() => linearFit(x, y)).toThrow(CalcInputError);
		expect(() => linearFit(x, y)).toThrow(message);
	});
});

describe('meanWithTypeA (JCGM 100:2008 §4.2)', () => {
	it('matches the means and Type A uncertainties of GUM Annex H.2', () => {
		// JCGM 100:2008 Annex H.2, Table H.2: five sets of observations of V, I and φ (data from
		// memory); published means and experimental standard deviations of the means
		// V = 4.9990 V, 0.0032 V; I = 19.6610 mA, 0.0095 mA; φ = 1.04446 rad, 0.00075 rad, read
		// in the GTC documentation (MSLNZ/GTC docs/API/GUM_H2.rst), which reproduces them.
		const V = meanWithTypeA([5.007, 4.994, 5.005, 4.99, 4.999]);
		expect(V.mean).toBeCloseTo(4.999, 4);
		expect(V.standardUncertainty).toBeCloseTo(0.0032, 4);
		expect(V.degreesOfFreedom).toBe(4);
		const I = meanWithTypeA([19.663, 19.639, 19.64, 19.685, 19.678]);
		expect(I.mean).toBeCloseTo(19.661, 4);
		expect(I.standardUncertainty).toBeCloseTo(0.0095, 4);
		const phi = meanWithTypeA([1.0456, 1.0438, 1.0468, 1.0428, 1.0433]);
		expect(phi.mean).toBeCloseTo(1.04446, 5);
		expect(phi.standardUncertainty).toBeCloseTo(0.00075, 5);
	});

	it('keeps its digits on the NIST numerical-accuracy data sets', () => {
		// NIST StRD, Univariate Summary Statistics (from memory): NumAcc1 is 10000001, 10000003,
		// 10000002 with certified mean 10000002 and standard deviation 1; NumAcc3 is 1000000.2
		// followed by 500 pairs 1000000.1, 1000000.3, certified mean 1000000.2 and s = 0.1.
		const acc1 = meanWithTypeA([10000001, 10000003, 10000002]);
		expect(acc1.mean).toBe(10000002);
		expect(acc1.standardUncertainty * Math.sqrt(3)).toBeCloseTo(1, 12);
		expect(acc1.degreesOfFreedom).toBe(2);
		const acc3 = meanWithTypeA([
			1000000.2,
			...Array.from({ length: 500 }, () => [1000000.1, 1000000.3]).flat()
		]);
		expect(acc3.mean).toBeCloseTo(1000000.2, 6);
		expect(acc3.standardUncertainty * Math.sqrt(1001)).toBeCloseTo(0.1, 8);
		expect(acc3.degreesOfFreedom).toBe(1000);
	});

	it('refuses fewer than two samples and samples that are not finite', () => {
		expect(() => meanWithTypeA([1])).toThrow(/samples = 1 values/);
		expect(() => meanWithTypeA([])).toThrow(CalcInputError);
		expect(() => meanWithTypeA([1, Number.NaN])).toThrow(/samples\[1\] = NaN/);
		expect(() => meanWithTypeA([1e308, 1e308])).toThrow(/overflows/);
	});
});
