import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CalcInputError, wakeSurveyDrag, type WakeSurvey } from './index';

const fill = (rows: number, columns: number, value: number | null) =>
	Array.from({ length: rows }, () => Array.from({ length: columns }, () => value));

/** A 3×3 survey on a 1 m pitch, free stream all round a centre point with the given readings. */
function centrePoint(cp: number | null, cp0: number | null): WakeSurvey {
	const pressureCoefficient = fill(3, 3, 0);
	const totalPressureCoefficient = fill(3, 3, 1);
	pressureCoefficient[1]![1] = cp;
	totalPressureCoefficient[1]![1] = cp0;
	return {
		y_m: [0, 1, 2],
		z_m: [0, 1, 2],
		pressureCoefficient,
		totalPressureCoefficient,
		referenceArea_m2: 1
	};
}

const codes = (notes: { code: string }[]) => notes.map((n) => n.code);

describe('wakeSurveyDrag (momentum balance, Anderson §2.6)', () => {
	it('integrates a uniform momentum deficit', () => {
		// Evaluated by hand from the momentum-deficit formula (Anderson, Fundamentals of
		// Aerodynamics, §2.6): u/U = 0.95 and Cp = 0 (Cp0 = 0.9025) over A = S/2 give
		// C_D = 2·0.95·0.05·0.5 = 0.0475. Here A = 0.3 m × 0.25 m = 0.075 m², S = 0.15 m².
		const drag = wakeSurveyDrag({
			y_m: [0, 0.1, 0.3],
			z_m: [-0.2, 0.05],
			pressureCoefficient: fill(3, 2, 0),
			totalPressureCoefficient: fill(3, 2, 0.9025),
			referenceArea_m2: 0.15
		});
		expect(drag.dragCoefficient).toBeCloseTo(0.0475, 12);
		expect(drag.integratedArea_m2).toBeCloseTo(0.075, 12);
		expect(codes(drag.notes)).toEqual(['wake-at-edge']);
	});

	it('integrates the static-pressure term exactly for a linear field on uneven spacing', () => {
		// Anderson §2.6 balance with u = U (Cp0 = 1 + Cp), so the integrand is −Cp. The trapezoidal
		// rule is exact for a bilinear integrand, and a linear field integrates to its value at the
		// centroid times the area. Evaluated by hand: Cp = −0.2·y − 0.125·z on y ∈ [0, 0.5] m,
		// z ∈ [0, 0.4] m, centroid Cp = −0.075, ∬ −Cp dA = 0.075 × 0.2 = 0.015 m²; S = 0.1 m²
		// → C_D = 0.15.
		const drag = wakeSurveyDrag({
			y_m: [0, 0.2, 0.5],
			z_m: [0, 0.4],
			pressureCoefficient: [
				[0, -0.05],
				[-0.04, -0.09],
				[-0.1, -0.15]
			],
			totalPressureCoefficient: [
				[1, 0.95],
				[0.96, 0.91],
				[0.9, 0.85]
			],
			referenceArea_m2: 0.1
		});
		expect(drag.dragCoefficient).toBeCloseTo(0.15, 12);
		expect(drag.integratedArea_m2).toBeCloseTo(0.2, 12);
	});

	it('weights an interior point by its cell and raises no caution for an enclosed wake', () => {
		// Evaluated by hand (Anderson §2.6): u/U = 0.8 at the centre (Cp0 = 0.64, Cp = 0) gives the
		// integrand 2·0.8·0.2 = 0.32 over a 1 m × 1 m trapezoidal cell; S = 1 m² → C_D = 0.32.
		const drag = wakeSurveyDrag(centrePoint(0, 0.64));
		expect(drag.dragCoefficient).toBeCloseTo(0.32, 12);
		expect(drag.integratedArea_m2).toBe(4);
		expect(drag.notes).toEqual([]);
	});

	it('takes total pressure below static as u = 0, with a caution', () => {
		// Cp0 − Cp = −0.2 < 0: u = 0, integrand −Cp = 0.3 (evaluated by hand, Anderson §2.6).
		const drag = wakeSurveyDrag(centrePoint(-0.3, -0.5));
		expect(drag.dragCoefficient).toBeCloseTo(0.3, 12);
		expect(codes(drag.notes)).toEqual(['wake-total-below-static']);
		expect(drag.notes[0]!.level).toBe('caution');
	});

	it('takes a missing reading as free stream and says how many', () => {
		const survey = centrePoint(0, 0.64);
		survey.pressureCoefficient[0]![2] = null;
		survey.totalPressureCoefficient[2]![0] = null;
		const drag = wakeSurveyDrag(survey);
		// Both missing points are free stream anyway, so C_D is still 0.32 (evaluated by hand).
		expect(drag.dragCoefficient).toBeCloseTo(0.32, 12);
		expect(codes(drag.notes)).toEqual(['wake-missing-readings']);
		expect(drag.notes[0]!.message).toMatch(/^2 points of 9/);
	});

	it('warns when the wake reaches the edge of the grid', () => {
		// An edge point at u/U = 0.9 carries 2·0.9·0.1 = 0.18, over 5 % of the centre's 0.32
		// (the 5 % share is common practice, no source).
		const survey = centrePoint(0, 0.64);
		survey.totalPressureCoefficient[0]![1] = 0.81;
		expect(codes(wakeSurveyDrag(survey).notes)).toEqual(['wake-at-edge']);
	});

	it('gives zero for a free-stream grid', () => {
		// Anderson §2.6: no momentum deficit and no pressure defect, no drag.
		const axis = fc
			.uniqueArray(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: 2, maxLength: 8 })
			.map((v) => [...v].sort((a, b) => a - b));
		fc.assert(
			fc.property(axis, axis, fc.double({ min: 1e-3, max: 10, noNaN: true }), (y, z, S) => {
				fc.pre(
					y.every((v, k) => k === 0 || v > y[k - 1]!) && z.every((v, k) => k === 0 || v > z[k - 1]!)
				);
				const drag = wakeSurveyDrag({
					y_m: y,
					z_m: z,
					pressureCoefficient: fill(y.length, z.length, 0),
					totalPressureCoefficient: fill(y.length, z.length, 1),
					referenceArea_m2: S
				});
				expect(drag.dragCoefficient).toBe(0);
				expect(drag.notes).toEqual([]);
			})
		);
	});

	it.each([
		[{ y_m: [0] }, /y_m = 1 positions/],
		[{ y_m: [0, 0, 2] }, /y_m\[1\] = 0/],
		[{ z_m: [0, 2, 1] }, /z_m\[2\] = 1/],
		[{ pressureCoefficient: fill(2, 3, 0) }, /pressureCoefficient = a 2×3 grid/],
		[{ totalPressureCoefficient: fill(3, 2, 1) }, /totalPressureCoefficient = a 3×2 grid/],
		[
			{
				totalPressureCoefficient: [
					[1, 1, 1],
					[1, 1],
					[1, 1, 1]
				]
			},
			/totalPressureCoefficient\[1\]/
		],
		[
			{
				pressureCoefficient: [
					[0, 0, 0],
					[0, Number.NaN, 0],
					[0, 0, 0]
				]
			},
			/pressureCoefficient\[1\]\[1\] = NaN/
		],
		[{ referenceArea_m2: 0 }, /referenceArea_m2 = 0/]
	])('refuses %j', (change, message) => {
		const survey = { ...centrePoint(0, 0.64), ...change } as WakeSurvey;
		expect(() => wakeSurveyDrag(survey)).toThrow(CalcInputError);
		expect(() => wakeSurveyDrag(survey)).toThrow(message);
	});
});
