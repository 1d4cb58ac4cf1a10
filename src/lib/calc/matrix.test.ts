import { describe, expect, it } from 'vitest';
import {
	CalcInputError,
	dynamicPressure,
	estimateOccupancy,
	expandMatrix,
	isaAtmosphere,
	machNumber,
	reynoldsNumber,
	uniformGrid,
	type FacilityTiming,
	type MatrixPlan
} from './index';

const air = isaAtmosphere(0);

function plan(overrides: Partial<MatrixPlan> = {}): MatrixPlan {
	return {
		configurations: [{ id: 'baseline', baseline: true }, { id: 'spoiler' }],
		speeds_mps: [20, 30, 40],
		yawAngles_deg: [0, 5],
		planes: [
			{
				id: 'x1',
				downstream_m: 0.5,
				grid: uniformGrid({ rows: 3, columns: 4, rowSpacing_m: 0.05, columnSpacing_m: 0.05 })
			},
			{ id: 'x2', downstream_m: 1.0, grid: { y_m: [0, 0.1], z_m: [-0.1, 0, 0.1] } }
		],
		dwellPerPoint_s: 10,
		repeats: 2,
		modelReferenceLength_m: 1.1,
		tunnelAir: air,
		dynamicPressureFactor: 1.03,
		...overrides
	};
}

describe('expandMatrix', () => {
	it('gives one row per measured point: configurations × yaws × speeds × plane points × repeats', () => {
		const rows = expandMatrix(plan());
		expect(rows).toHaveLength(2 * 2 * 3 * (12 + 6) * 2);
		expect(rows.map((r) => r.point)).toEqual(rows.map((_, i) => i + 1));
	});

	it('orders runs configuration, yaw, speed, plane, repeat, then points row by row', () => {
		const rows = expandMatrix(plan());
		expect(rows[0]).toMatchObject({
			configurationId: 'baseline',
			yaw_deg: 0,
			speed_mps: 20,
			planeId: 'x1',
			repeat: 1,
			row: 1,
			column: 1,
			run: 1
		});
		expect(rows[1]).toMatchObject({ row: 1, column: 2, z_m: 0.05 });
		expect(rows[4]).toMatchObject({ row: 2, column: 1, y_m: 0.05 });
		expect(rows[12]).toMatchObject({ planeId: 'x1', repeat: 2, run: 2 });
		expect(rows[24]).toMatchObject({ planeId: 'x2', repeat: 1, run: 3, downstream_m: 1.0 });
		expect(rows.at(-1)).toMatchObject({
			configurationId: 'spoiler',
			yaw_deg: 5,
			speed_mps: 40,
			planeId: 'x2',
			repeat: 2,
			run: 2 * 2 * 3 * 2 * 2
		});
	});

	it('carries the flow quantities of each row’s speed', () => {
		for (const row of expandMatrix(plan())) {
			const q = dynamicPressure(row.speed_mps, air);
			expect(row.dynamicPressure_Pa).toBe(q);
			// 1 mmH2O = 9.80665 Pa (NIST SP 811, B.8).
			expect(row.dynamicPressure_mmH2O).toBeCloseTo(q / 9.80665, 12);
			expect(row.correctedDynamicPressure_Pa).toBeCloseTo(q * 1.03, 12);
			expect(row.modelRe).toBe(reynoldsNumber(row.speed_mps, 1.1, air));
			expect(row.mach).toBe(machNumber(row.speed_mps, air));
		}
	});

	it.each<[string, Partial<MatrixPlan>, RegExp]>([
		['a duplicate speed', { speeds_mps: [20, 30, 20] }, /speeds_mps = 20 .* each appear once/],
		['a duplicate yaw', { yawAngles_deg: [0, 0] }, /yawAngles_deg/],
		['a negative speed', { speeds_mps: [-5] }, /speeds_mps\[0\] = -5/],
		['no configurations', { configurations: [] }, /configurations/],
		['zero repeats', { repeats: 0 }, /repeats = 0/],
		[
			'a plane over 10 000 points',
			{
				planes: [
					{
						id: 'big',
						downstream_m: 1,
						grid: {
							y_m: Array.from({ length: 101 }, (_, i) => i * 0.01),
							z_m: Array.from({ length: 100 }, (_, j) => j * 0.01)
						}
					}
				]
			},
			/at most 10000 points in one plane/
		],
		['a matrix over 250 000 points', { repeats: 2000 }, /at most 250000 points in one matrix/]
	])('refuses %s', (_, overrides, message) => {
		expect(() => expandMatrix(plan(overrides))).toThrow(CalcInputError);
		expect(() => expandMatrix(plan(overrides))).toThrow(message);
	});
});

describe('uniformGrid', () => {
	it.each([
		[101, 100],
		[3e7, 1],
		[2 ** 32, 1]
	])('refuses %d × %d points before building the grid', (rows, columns) => {
		const started = performance.now();
		expect(() => uniformGrid({ rows, columns, rowSpacing_m: 0.01, columnSpacing_m: 0.01 })).toThrow(
			/at most 10000 points in one plane/
		);
		// Building 3e7 positions takes seconds; refusing takes no time (common practice, no source).
		expect(performance.now() - started).toBeLessThan(50);
	});
});

describe('estimateOccupancy', () => {
	const timing: FacilityTiming = {
		settling_s: 60,
		traverseMove_s: 4,
		yawChange_s: 45,
		modelChange_s: 1800,
		setUp_s: 10800,
		tearDown_s: 7200
	};

	it('adds set-up, model and yaw changes, settling per speed, and a move and dwell per point', () => {
		// Planning times are facility settings (common practice, no source); the sum is
		// checked here by hand for 2 configurations × 2 yaws × 3 speeds × 18 points × 2 repeats.
		const o = estimateOccupancy(plan(), timing);
		const points = 2 * 2 * 3 * 18 * 2;
		expect(o.counts).toEqual({
			runs: 2 * 2 * 3 * 2 * 2,
			points,
			modelChanges: 1,
			yawChanges: 2,
			speedSettings: 12
		});
		expect(o.breakdown).toEqual({
			setUpAndTearDown_s: 18000,
			modelChanges_s: 1800,
			yawChanges_s: 90,
			settling_s: 720,
			traverseMoves_s: points * 4,
			dwell_s: points * 10
		});
		expect(o.total_s).toBe(18000 + 1800 + 90 + 720 + points * 14);
		expect(o.counts.points).toBe(expandMatrix(plan()).length);
	});

	it('refuses negative facility times', () => {
		expect(() => estimateOccupancy(plan(), { ...timing, settling_s: -1 })).toThrow(
			/facility.settling_s/
		);
	});
});
