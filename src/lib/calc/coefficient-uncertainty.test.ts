import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
	cpDifferenceUncertainty,
	meanCpUncertainty,
	pressureCoefficient,
	propagateUncertainty
} from './index';

// The closed forms must agree with first-order propagation of the same models by central
// differences, JCGM 100:2008 eq. 10 (uncorrelated) and eq. 13 (correlated q).
const cp = fc.double({ min: -3, max: 1, noNaN: true });
const q = fc.double({ min: 5, max: 3000, noNaN: true });
const uP = fc.double({ min: 0, max: 20, noNaN: true });
const e = fc.double({ min: 0, max: 0.05, noNaN: true });
const n = fc.integer({ min: 1, max: 2000 });

describe('meanCpUncertainty', () => {
	it('agrees with propagateUncertainty for p̄/q (JCGM 100:2008 eq. 10)', () => {
		fc.assert(
			fc.property(cp, n, q, uP, e, (c, readings, qq, u, eps) => {
				const budget = propagateUncertainty(
					(x) => pressureCoefficient(x.p!, x.q!),
					[
						{ name: 'p', value: c * qq, standardUncertainty: u / Math.sqrt(readings) },
						{ name: 'q', value: qq, standardUncertainty: eps * qq }
					]
				);
				const closed = meanCpUncertainty({
					cp: c,
					readings,
					dynamicPressure_Pa: qq,
					readingUncertainty_Pa: u,
					relativeDynamicPressureUncertainty: eps
				});
				expect(closed).toBeCloseTo(budget.standardUncertainty, 9);
			})
		);
	});

	it('matches a case evaluated by hand', () => {
		// JCGM 100:2008 eq. 10: u² = (1/√4 / 50)² + (−0.5 · 0.01)² = 1e-4 + 2.5e-5.
		expect(
			meanCpUncertainty({
				cp: -0.5,
				readings: 4,
				dynamicPressure_Pa: 50,
				readingUncertainty_Pa: 1,
				relativeDynamicPressureUncertainty: 0.01
			})
		).toBeCloseTo(Math.sqrt(1.25e-4), 12);
	});
});

describe('cpDifferenceUncertainty', () => {
	it('agrees with propagateUncertainty for p̄_v/q_v − p̄_b/q_b with correlated q (JCGM 100:2008 eq. 13)', () => {
		fc.assert(
			fc.property(
				cp,
				cp,
				n,
				q,
				q,
				uP,
				e,
				fc.double({ min: -1, max: 1, noNaN: true }),
				(cv, cb, readings, qv, qb, u, eps, r) => {
					const uMean = u / Math.sqrt(readings);
					const budget = propagateUncertainty(
						(x) => pressureCoefficient(x.pv!, x.qv!) - pressureCoefficient(x.pb!, x.qb!),
						[
							{ name: 'pv', value: cv * qv, standardUncertainty: uMean },
							{ name: 'pb', value: cb * qb, standardUncertainty: uMean },
							{ name: 'qv', value: qv, standardUncertainty: eps * qv },
							{ name: 'qb', value: qb, standardUncertainty: eps * qb }
						],
						{ correlations: [{ a: 'qv', b: 'qb', r }] }
					);
					const closed = cpDifferenceUncertainty({
						variantCp: cv,
						baselineCp: cb,
						readings,
						variantDynamicPressure_Pa: qv,
						baselineDynamicPressure_Pa: qb,
						readingUncertainty_Pa: u,
						relativeDynamicPressureUncertainty: eps,
						dynamicPressureCorrelation: r
					});
					expect(closed).toBeCloseTo(budget.standardUncertainty, 8);
				}
			)
		);
	});

	it('lets a shared reference cancel where the two Cp agree', () => {
		// JCGM 100:2008 eq. 13 with r = 1 and equal Cp: only the readings remain, u_p·√2/(√n·q).
		expect(
			cpDifferenceUncertainty({
				variantCp: -0.3,
				baselineCp: -0.3,
				readings: 9,
				variantDynamicPressure_Pa: 100,
				baselineDynamicPressure_Pa: 100,
				readingUncertainty_Pa: 3,
				relativeDynamicPressureUncertainty: 0.02,
				dynamicPressureCorrelation: 1
			})
		).toBeCloseTo((3 * Math.SQRT2) / 3 / 100, 12);
	});
});
