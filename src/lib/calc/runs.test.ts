import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
	dryAirState,
	expandMatrix,
	locatePoint,
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
					for (const r of expanded) {
						const at = locatePoint(layout, r.point)!;
						expect([at.run.run, at.row, at.column]).toEqual([r.run, r.row, r.column]);
						expect(at.run.configurationId).toBe(r.configurationId);
						expect(at.run.planeId).toBe(r.planeId);
						expect(at.run.speed_mps).toBe(r.speed_mps);
						expect(at.run.yaw_deg).toBe(r.yaw_deg);
						expect(at.run.repeat).toBe(r.repeat);
						expect(pointAt(layout, r.run, r.row, r.column)).toBe(r.point);
					}
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
