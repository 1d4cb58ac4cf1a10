import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { blockageCorrectedCp, CalcInputError, pressureCoefficient } from './index';

describe('pressureCoefficient', () => {
	it('is 1 at a stagnation point', () => {
		// Bernoulli (Anderson, Fundamentals of Aerodynamics, §3.2): at a stagnation point in
		// incompressible flow p − p∞ = q∞, so Cp = 1.
		expect(pressureCoefficient(612.5, 612.5)).toBe(1);
	});

	it('gives −3 at the shoulder of a cylinder in potential flow', () => {
		// Anderson, Fundamentals of Aerodynamics, §3.13 (from memory): Cp = 1 − 4 sin²θ on a
		// circular cylinder, −3 at θ = 90°; with q∞ = 400 Pa that point reads p − p∞ = −1200 Pa.
		expect(pressureCoefficient(-1200, 400)).toBeCloseTo(-3, 12);
	});

	it('refuses a dynamic pressure that is not positive', () => {
		expect(() => pressureCoefficient(10, 0)).toThrow(CalcInputError);
		expect(() => pressureCoefficient(10, -5)).toThrow(/dynamicPressure_Pa = -5/);
		expect(() => pressureCoefficient(Number.NaN, 100)).toThrow(/gaugePressure_Pa = NaN/);
		expect(() => pressureCoefficient(1e308, 1e-308)).toThrow(CalcInputError);
	});
});

describe('blockageCorrectedCp', () => {
	it('agrees with Cp re-read against the corrected free stream', () => {
		// Bernoulli (Anderson, §3.2): the correction keeps the total pressure p0, so the corrected
		// static pressure is p∞c = p0 − q_c. Evaluated by hand: q_u = 500 Pa, q_c/q_u = 1.08
		// (q_c = 540 Pa), a tap reading p − p∞u = −700 Pa has Cp_u = −1.4 and
		// p − p∞c = −700 + (540 − 500) = −660 Pa, so Cp_c = −660/540 = −1.222 222….
		expect(blockageCorrectedCp(-1.4, 1.08)).toBeCloseTo(-1.2222222222, 9);
	});

	it('leaves a stagnation point at 1 and changes nothing without blockage', () => {
		// Bernoulli (Anderson, §3.2): Cp = 1 wherever the local total pressure is p0, whatever q.
		fc.assert(
			fc.property(
				fc.double({ min: 0.5, max: 2, noNaN: true }),
				fc.double({ min: -10, max: 1, noNaN: true }),
				(factor, cp) => {
					expect(blockageCorrectedCp(1, factor)).toBe(1);
					expect(blockageCorrectedCp(cp, 1)).toBeCloseTo(cp, 12);
				}
			)
		);
	});

	it('refuses a factor that is not positive', () => {
		expect(() => blockageCorrectedCp(-0.5, 0)).toThrow(/dynamicPressureFactor = 0/);
		expect(() => blockageCorrectedCp(-0.5, -1.1)).toThrow(CalcInputError);
		expect(() => blockageCorrectedCp(Number.POSITIVE_INFINITY, 1.1)).toThrow(/cp = Infinity/);
	});
});
