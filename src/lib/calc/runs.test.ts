import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
	dryAirState,
	expandMatrix,
	locatePoint,
	matrixRows,
	pointAt,
	runLayout,
	type MatrixPlan
} from './index';

// Self-consistency against the row-by-row expansion, which the matrix tests already pin down.
const plan = (rows: number, columns: number, repeats: number): MatrixPlan => ({
	configurations: [{ id: 'a', baseline: true }, { id: 'b' }],
	speeds_mps: [10, 20],
	yawAngles_deg: [0, 5, 10],
	planes: [
		{ id: 'p1', downstream_m: 0.2, grid: { y_m: range(rows), z_m: range(columns) } },
		{ id: 'p2', downstream_m: 0.4, grid: { y_m: range(2), z_m: range(3) } }
	],
	dwellPerPoint_s: 1,
	repeats,
	modelReferenceLength_m: 0.3,
	tunnelAir: dryAirState(293.15, 101325)
});
const range = (n: number) => Array.from({ length: n }, (_, i) => i * 0.01);

describe('runLayout', () => {
	it('numbers runs and points as expandMatrix does', () => {
		fc.assert(
			fc.property(
				fc.integer({ min: 1, max: 5 }),
				fc.integer({ min: 1, max: 5 }),
				fc.integer({ min: 1, max: 3 }),
				(rows, columns, repeats) => {
					const p = plan(rows, columns, repeats);
					const layout = runLayout(p);
					const expanded = expandMatrix(p);
					expect(layout.pointCount).toBe(expanded.length);
					// One comparison per case: 220 000 single expects made this the slowest test.
					const located = expanded.map((r) => {
						const at = locatePoint(layout, r.point)!;
						const { run } = at.run;
						const { configurationId, planeId, speed_mps, yaw_deg, repeat } = at.run;
						const back = pointAt(layout, r.run, r.row, r.column);
						return [
							run,
							at.row,
							at.column,
							configurationId,
							planeId,
							speed_mps,
							yaw_deg,
							repeat,
							back
						];
					});
					expect(located).toEqual(
						expanded.map((r) => [
							r.run,
							r.row,
							r.column,
							r.configurationId,
							r.planeId,
							r.speed_mps,
							r.yaw_deg,
							r.repeat,
							r.point
						])
					);
				}
			),
			{ numRuns: 20 }
		);
	});

	it('has no point outside the matrix', () => {
		const layout = runLayout(plan(2, 2, 1));
		expect(locatePoint(layout, 0)).toBeUndefined();
		expect(locatePoint(layout, layout.pointCount + 1)).toBeUndefined();
		expect(locatePoint(layout, 1.5)).toBeUndefined();
		expect(pointAt(layout, 1, 3, 1)).toBeUndefined();
		expect(pointAt(layout, 1, 1, 0)).toBeUndefined();
		expect(pointAt(layout, layout.runs.length + 1, 1, 1)).toBeUndefined();
	});
});

describe('matrixRows', () => {
	it('gives the same rows as the full expansion for any page', () => {
		fc.assert(
			fc.property(
				fc.integer({ min: 1, max: 4 }),
				fc.integer({ min: 1, max: 4 }),
				fc.integer({ min: 0, max: 300 }),
				fc.integer({ min: 1, max: 80 }),
				(rows, columns, offset, limit) => {
					const p = plan(rows, columns, 2);
					expect(matrixRows(p, offset, limit)).toEqual(
						expandMatrix(p).slice(offset, offset + limit)
					);
				}
			),
			{ numRuns: 30 }
		);
	});
});
