import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CalcInputError, gridAverages, matchedDifference } from './index';

/** A grid of up to 6×6 points, each a reading from `reading` or null, with at least one reading. */
const gridOf = (reading: fc.Arbitrary<number>) =>
	fc
		.tuple(fc.integer({ min: 1, max: 6 }), fc.integer({ min: 1, max: 6 }))
		.chain(([rows, columns]) =>
			fc.array(
				fc.array(fc.option(reading, { nil: null, freq: 3 }), {
					minLength: columns,
					maxLength: columns
				}),
				{ minLength: rows, maxLength: rows }
			)
		)
		.filter((g) => g.some((row) => row.some((v) => v !== null)));

describe('gridAverages', () => {
	it('averages rows, columns and the plane', () => {
		// Evaluated by hand: [[−0.2, −0.3], [−0.1, −0.4]] → rows −0.25, −0.25;
		// columns −0.15, −0.35; plane −0.25.
		const a = gridAverages([
			[-0.2, -0.3],
			[-0.1, -0.4]
		]);
		expect(a.rows[0]).toBeCloseTo(-0.25, 12);
		expect(a.rows[1]).toBeCloseTo(-0.25, 12);
		expect(a.columns[0]).toBeCloseTo(-0.15, 12);
		expect(a.columns[1]).toBeCloseTo(-0.35, 12);
		expect(a.plane).toBeCloseTo(-0.25, 12);
		expect(a.count).toBe(4);
	});

	it('skips missing readings and averages the plane over readings, not row means', () => {
		// Evaluated by hand: [[1, null], [null, null], [3, 5]] → rows 1, none, 4; columns 2, 5;
		// plane (1 + 3 + 5)/3 = 3 (the mean of the row means would be 2.5).
		const a = gridAverages([
			[1, null],
			[null, null],
			[3, 5]
		]);
		expect(a.rows).toEqual([1, null, 4]);
		expect(a.columns).toEqual([2, 5]);
		expect(a.plane).toBe(3);
		expect(a.count).toBe(3);
	});

	it.each([
		[[], /values = \[\]/],
		[[[]], /values\[0\] = \[\]/],
		[[[1, 2], [3]], /values\[1\] = a row of 1/],
		[[[1, Number.NaN]], /values\[0\]\[1\] = NaN/],
		[[[1, Number.POSITIVE_INFINITY]], /values\[0\]\[1\] = Infinity/],
		[
			[
				[null, null],
				[null, null]
			],
			/values = no reading/
		]
	])('refuses %j', (values, message) => {
		expect(() => gridAverages(values)).toThrow(CalcInputError);
		expect(() => gridAverages(values)).toThrow(message);
	});

	it('gives the constant back for a constant grid', () => {
		// Property of the arithmetic mean (common practice, no source).
		fc.assert(
			fc.property(
				fc.double({ min: -1e6, max: 1e6, noNaN: true }),
				gridOf(fc.constant(0)),
				(c, shape) => {
					const grid = shape.map((row) => row.map((v) => (v === null ? null : c)));
					const a = gridAverages(grid);
					const near = (v: number | null) =>
						Math.abs((v ?? c) - c) <= 1e-12 * Math.max(1, Math.abs(c));
					expect(near(a.plane)).toBe(true);
					expect(a.rows.every(near)).toBe(true);
					expect(a.columns.every(near)).toBe(true);
					expect(a.rows.map((r) => r === null)).toEqual(
						grid.map((row) => row.every((v) => v === null))
					);
				}
			)
		);
	});
});

describe('matchedDifference', () => {
	it('compares only points read in both grids', () => {
		// Evaluated by hand: variant [[−0.30, −0.25], [null, −0.40]] less baseline
		// [[−0.20, null], [−0.10, −0.35]] → points [[−0.10, null], [null, −0.05]];
		// rows −0.10, −0.05; columns −0.10, −0.05; plane −0.075 over 2 points.
		const d = matchedDifference(
			[
				[-0.3, -0.25],
				[null, -0.4]
			],
			[
				[-0.2, null],
				[-0.1, -0.35]
			]
		);
		expect(d.points[0]![0]).toBeCloseTo(-0.1, 12);
		expect(d.points[0]![1]).toBeNull();
		expect(d.points[1]![0]).toBeNull();
		expect(d.points[1]![1]).toBeCloseTo(-0.05, 12);
		expect(d.rows[0]).toBeCloseTo(-0.1, 12);
		expect(d.rows[1]).toBeCloseTo(-0.05, 12);
		expect(d.columns[0]).toBeCloseTo(-0.1, 12);
		expect(d.columns[1]).toBeCloseTo(-0.05, 12);
		expect(d.plane).toBeCloseTo(-0.075, 12);
		expect(d.count).toBe(2);
	});

	it('refuses grids of different shapes and grids with no point in common', () => {
		expect(() => matchedDifference([[1, 2]], [[1], [2]])).toThrow(/baseline = a 2×1 grid/);
		expect(() => matchedDifference([[1, null]], [[null, 2]])).toThrow(/at least one matched point/);
		expect(() => matchedDifference([[1e308]], [[-1e308]])).toThrow(CalcInputError);
		expect(() =>
			matchedDifference(
				[[1, 2], [3]],
				[
					[1, 2],
					[3, 4]
				]
			)
		).toThrow(/variant\[1\]/);
	});

	it('is zero wherever a grid compared with itself has a reading', () => {
		// x − x = 0 (common practice, no source).
		fc.assert(
			fc.property(gridOf(fc.double({ min: -1e6, max: 1e6, noNaN: true })), (grid) => {
				const d = matchedDifference(grid, grid);
				expect(d.points).toEqual(grid.map((row) => row.map((v) => (v === null ? null : 0))));
				expect(d.plane).toBe(0);
				expect(d.count).toBe(grid.flat().filter((v) => v !== null).length);
			})
		);
	});
});
