import { describe, expect, it } from 'vitest';
import {
	estimateOccupancy,
	isaAtmosphere,
	uniformGrid,
	type FacilityTiming,
	type MatrixPlan
} from '../calc';
import { runSheet } from './run-sheet';

const plan: MatrixPlan = {
	configurations: [{ id: 'a', baseline: true }, { id: 'b' }],
	speeds_mps: [20, 30],
	yawAngles_deg: [0, 5, 10],
	planes: [
		{
			id: 'p1',
			downstream_m: 0.5,
			grid: uniformGrid({ rows: 2, columns: 3, rowSpacing_m: 0.1, columnSpacing_m: 0.1 })
		},
		{ id: 'p2', downstream_m: 1, grid: { y_m: [0], z_m: [0, 0.1] } }
	],
	dwellPerPoint_s: 7,
	repeats: 2,
	modelReferenceLength_m: 1,
	tunnelAir: isaAtmosphere(0)
};
const timing: FacilityTiming = {
	settling_s: 60,
	traverseMove_s: 3,
	yawChange_s: 40,
	modelChange_s: 1200,
	setUp_s: 3600,
	tearDown_s: 1800
};

describe('runSheet', () => {
	it('ends at the occupancy estimate, so the sheet and the booking agree', () => {
		const sheet = runSheet(plan, timing);
		expect(sheet.end_s).toBe(estimateOccupancy(plan, timing).total_s);
		expect(sheet.lines).toHaveLength(estimateOccupancy(plan, timing).counts.runs);
	});

	it('puts the changes before the run they precede', () => {
		const { lines } = runSheet(plan, timing);
		expect(lines[0]).toMatchObject({
			run: 1,
			configurationId: 'a',
			yaw_deg: 0,
			speed_mps: 20,
			planeId: 'p1',
			repeat: 1,
			before: ['settling'],
			start_s: 3660
		});
		expect(lines[1]!.before).toEqual([]);
		expect(lines[1]!.start_s).toBe(3660 + 6 * 10);
		const secondYaw = lines.find((l) => l.configurationId === 'a' && l.yaw_deg === 5)!;
		expect(secondYaw.before).toEqual(['yaw change', 'settling']);
		const secondConfiguration = lines.find((l) => l.configurationId === 'b')!;
		expect(secondConfiguration.before).toEqual(['model change', 'settling']);
	});
});
