import { describe, expect, it } from 'vitest';
import { CalcInputError, reynoldsSweep } from './index';

describe('reynoldsSweep', () => {
	it('sorts by Re and finds where the changes settle within the tolerance', () => {
		// Evaluated by hand from the definition (v[i+1] − v[i])/v[i]: sorted values 0.40, 0.33,
		// 0.30, 0.303 at Re 1e5, 2e5, 4e5, 8e5 change by −0.175, −0.090 909…, +0.01; within 2 %
		// only from 4e5 on.
		const sweep = reynoldsSweep(
			[
				{ re: 4e5, value: 0.3 },
				{ re: 1e5, value: 0.4 },
				{ re: 8e5, value: 0.303 },
				{ re: 2e5, value: 0.33 }
			],
			0.02
		);
		expect(sweep.relativeChanges).toHaveLength(3);
		expect(sweep.relativeChanges[0]).toBeCloseTo(-0.175, 12);
		expect(sweep.relativeChanges[1]).toBeCloseTo(-0.0909090909, 9);
		expect(sweep.relativeChanges[2]).toBeCloseTo(0.01, 12);
		expect(sweep.independentFromRe).toBe(4e5);
	});

	it('counts a change equal to the tolerance as within it and answers the lowest Re', () => {
		// Evaluated by hand: 1 → 1.5 → 1.5 changes by 0.5 and 0; both within 0.5.
		const sweep = reynoldsSweep(
			[
				{ re: 1e5, value: 1 },
				{ re: 2e5, value: 1.5 },
				{ re: 3e5, value: 1.5 }
			],
			0.5
		);
		expect(sweep.relativeChanges).toEqual([0.5, 0]);
		expect(sweep.independentFromRe).toBe(1e5);
	});

	it('answers null when the last change is outside the tolerance, or with fewer than 2 points', () => {
		// Evaluated by hand: 1 → 1 → 1.1 ends with a change of 10 %.
		expect(
			reynoldsSweep(
				[
					{ re: 1e5, value: 1 },
					{ re: 2e5, value: 1 },
					{ re: 3e5, value: 1.1 }
				],
				0.05
			).independentFromRe
		).toBeNull();
		expect(reynoldsSweep([{ re: 1e5, value: 0.3 }], 0.01)).toEqual({
			relativeChanges: [],
			independentFromRe: null
		});
		expect(reynoldsSweep([], 0.01)).toEqual({ relativeChanges: [], independentFromRe: null });
	});

	it('refuses a zero it would divide by, repeated Re and bad input', () => {
		const zero = [
			{ re: 2e5, value: 0.3 },
			{ re: 1e5, value: 0 }
		];
		expect(() => reynoldsSweep(zero, 0.01)).toThrow(CalcInputError);
		expect(() => reynoldsSweep(zero, 0.01)).toThrow(/points\[1\]\.value = 0/);
		expect(() =>
			reynoldsSweep(
				[
					{ re: 1e5, value: 0.3 },
					{ re: 1e5, value: 0.31 }
				],
				0.01
			)
		).toThrow(/points\[1\]\.re = 100000/);
		expect(() => reynoldsSweep([{ re: -1, value: 1 }], 0.01)).toThrow(/points\[0\]\.re = -1/);
		expect(() => reynoldsSweep([{ re: 1e5, value: Number.NaN }], 0.01)).toThrow(CalcInputError);
		expect(() => reynoldsSweep([], -0.01)).toThrow(/tolerance = -0.01/);
	});

	it('lets the value at the highest Re be zero', () => {
		// Evaluated by hand: 0.2 → 0 is a change of −1; only divisors must be non-zero.
		expect(
			reynoldsSweep(
				[
					{ re: 1e5, value: 0.2 },
					{ re: 2e5, value: 0 }
				],
				0.01
			).relativeChanges
		).toEqual([-1]);
	});
});
