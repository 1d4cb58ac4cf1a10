import { describe, expect, it } from 'vitest';
import { locatePoint, pointAt, type MeasurementPlane, type RunLayout } from '../../calc';
import { readingRowSchema } from '../../schemas/readings';
import { checkIdentity, locateRow } from './point-location';
import { ProblemList } from './problems';

const run = (n: number, firstPoint: number, rows: number, columns: number) => ({
	run: n,
	firstPoint,
	rows,
	columns,
	configurationId: 'clean',
	yaw_deg: 0,
	speed_mps: 20,
	planeId: 'near',
	repeat: n
});
const layout: RunLayout = { runs: [run(1, 1, 2, 3), run(2, 7, 2, 3)], pointCount: 12 };
const planes = new Map<string, MeasurementPlane>([
	['near', { id: 'near', downstream_m: 0.5, grid: { y_m: [0.1, 0.2], z_m: [-0.1, 0, 0.1] } }]
]);

const row = (cells: Record<string, string>) =>
	readingRowSchema.parse({ kind: 'static', reading: '1', unit: 'Pa', ...cells });

describe('locating a row in the approved matrix', () => {
	it('finds the point the core’s layout gives, by number or by run, row and column', () => {
		const problems = new ProblemList();
		for (let point = 1; point <= layout.pointCount; point++) {
			const at = locatePoint(layout, point)!;
			expect(locateRow(row({ point: String(point) }), layout, 2, problems)).toEqual({
				...at,
				point
			});
			const named = row({
				run: String(at.run.run),
				row: String(at.row),
				column: String(at.column)
			});
			expect(locateRow(named, layout, 2, problems)?.point).toBe(
				pointAt(layout, at.run.run, at.row, at.column)
			);
		}
		expect(problems.count).toBe(0);
	});

	it('says why a row names no point of the matrix', () => {
		const problems = new ProblemList();
		expect(locateRow(row({ point: '13' }), layout, 2, problems)).toBeUndefined();
		expect(
			locateRow(row({ run: '3', row: '1', column: '1' }), layout, 3, problems)
		).toBeUndefined();
		expect(
			locateRow(row({ run: '2', row: '3', column: '1' }), layout, 4, problems)
		).toBeUndefined();
		expect(
			locateRow(row({ run: '2', row: '1', column: '4' }), layout, 5, problems)
		).toBeUndefined();
		expect(
			locateRow(row({ point: '7', run: '1', row: '1', column: '1' }), layout, 6, problems)
		).toBeUndefined();
		expect(problems.shown.map((p) => `${p.row} ${p.column}: ${p.reason}`)).toEqual([
			'2 point: 13 is not in the approved matrix (points 1–12)',
			'3 run: 3 is not a run of the approved matrix (runs 1–2)',
			"4 row: 3 is outside run 2's probe rows 1–2",
			"5 column: 4 is outside run 2's probe columns 1–3",
			'6 run: run 1, row 1, column 1 is point 1, not point 7'
		]);
	});

	it('holds a row’s repeated identity to the matrix’s', () => {
		const problems = new ProblemList();
		// Point 9 is run 2 (repeat 2), probe row 1 at y = 0.1 m, column 3 at z = 0.1 m.
		const r = row({ point: '9', repeat: '1', z_m: '0', y_m: '0.1' });
		checkIdentity(r, { ...locatePoint(layout, 9)!, point: 9 }, planes, 8, problems);
		expect(problems.shown.map((p) => p.column)).toEqual(['repeat', 'z_m']);
	});
});
