import { describe, expect, it } from 'vitest';
import type { RunLayout } from '../calc';
import { coveredFraction, readingsCoverageOf } from './coverage';

const run = (n: number, firstPoint: number, planeId: string) => ({
	run: n,
	firstPoint,
	rows: 2,
	columns: 2,
	configurationId: 'clean',
	yaw_deg: 0,
	speed_mps: 20,
	planeId,
	repeat: 1
});
const layout: RunLayout = {
	runs: [run(1, 1, 'near'), run(2, 5, 'near'), run(3, 9, 'far')],
	pointCount: 12
};
const plan = { planes: [{ id: 'near' }, { id: 'far' }] } as Parameters<
	typeof readingsCoverageOf
>[1];

describe('readings coverage', () => {
	it('calls a run complete only with every point read and its reference conditions', () => {
		const coverage = readingsCoverageOf(3, plan, layout, {
			pointsByRun: new Map([
				[1, 4],
				[2, 4]
			]),
			runsWithConditions: new Set([1]),
			readingCount: 9
		});
		expect(coverage.perRun.map((r) => r.state)).toEqual(['complete', 'partial', 'missing']);
		expect(coverage.runs).toEqual({ planned: 3, complete: 1, partial: 1, missing: 1 });
		expect(coverage.missingRuns).toEqual([3]);
		expect(coverage.perPlane).toEqual([
			{ planeId: 'near', plannedPoints: 8, pointsWithReadings: 8, runs: 2, runsComplete: 1 },
			{ planeId: 'far', plannedPoints: 4, pointsWithReadings: 0, runs: 1, runsComplete: 0 }
		]);
		expect(coverage).toMatchObject({
			revisionNumber: 3,
			plannedPoints: 12,
			pointsWithReadings: 8,
			readingCount: 9
		});
		expect(coveredFraction(coverage)).toBeCloseTo(8 / 12, 12);
	});

	it('gives an empty matrix no fraction rather than a division by zero', () => {
		expect(coveredFraction({ plannedPoints: 0, pointsWithReadings: 0 })).toBe(0);
	});
});
