import type { MatrixPlan, RunLayout } from '../calc';
import type { ReadingsCoverage, RunCoverage } from './types';

/** What the stored readings of a revision say, counted by the server. */
export type StoredCounts = {
	/** Distinct points with a current reading, per run number. */
	pointsByRun: ReadonlyMap<number, number>;
	/** Runs with current reference conditions. */
	runsWithConditions: ReadonlySet<number>;
	readingCount: number;
};

function runState(planned: number, read: number, hasConditions: boolean): RunCoverage['state'] {
	if (read === 0) return 'missing';
	return read === planned && hasConditions ? 'complete' : 'partial';
}

/**
 * How much of the approved matrix has readings: per run, per plane and overall. A run is
 * complete when every planned point has a reading and the run has its reference conditions.
 */
export function readingsCoverageOf(
	revisionNumber: number,
	plan: Pick<MatrixPlan, 'planes'>,
	layout: RunLayout,
	stored: StoredCounts
): ReadingsCoverage {
	const perRun: RunCoverage[] = layout.runs.map((r) => {
		const plannedPoints = r.rows * r.columns;
		const pointsWithReadings = stored.pointsByRun.get(r.run) ?? 0;
		const hasConditions = stored.runsWithConditions.has(r.run);
		return {
			run: r.run,
			configurationId: r.configurationId,
			yaw_deg: r.yaw_deg,
			speed_mps: r.speed_mps,
			planeId: r.planeId,
			repeat: r.repeat,
			plannedPoints,
			pointsWithReadings,
			hasConditions,
			state: runState(plannedPoints, pointsWithReadings, hasConditions)
		};
	});
	const sum = (runs: RunCoverage[], of: (r: RunCoverage) => number) =>
		runs.reduce((n, r) => n + of(r), 0);
	const perPlane = plan.planes.map((p) => {
		const runs = perRun.filter((r) => r.planeId === p.id);
		return {
			planeId: p.id,
			plannedPoints: sum(runs, (r) => r.plannedPoints),
			pointsWithReadings: sum(runs, (r) => r.pointsWithReadings),
			runs: runs.length,
			runsComplete: runs.filter((r) => r.state === 'complete').length
		};
	});
	const inState = (state: RunCoverage['state']) => perRun.filter((r) => r.state === state);
	return {
		revisionNumber,
		plannedPoints: layout.pointCount,
		pointsWithReadings: sum(perRun, (r) => r.pointsWithReadings),
		readingCount: stored.readingCount,
		runs: {
			planned: perRun.length,
			complete: inState('complete').length,
			partial: inState('partial').length,
			missing: inState('missing').length
		},
		missingRuns: inState('missing').map((r) => r.run),
		perPlane,
		perRun
	};
}

/** The fraction of planned points that have a reading; 0 for an empty matrix. */
export const coveredFraction = (
	coverage: Pick<ReadingsCoverage, 'plannedPoints' | 'pointsWithReadings'>
) => (coverage.plannedPoints ? coverage.pointsWithReadings / coverage.plannedPoints : 0);
