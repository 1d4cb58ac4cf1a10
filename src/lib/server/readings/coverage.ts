import { and, asc, desc, eq, isNull, sql } from 'drizzle-orm';
import { locatePoint, type RunIdentity } from '../../calc';
import type { DbOrTx } from '../db/open';
import { reading, readingsUpload, runCondition } from '../db/schema';
import type { ApprovedLayout } from './layout';

export type RunCoverage = RunIdentity & {
	plannedPoints: number;
	pointsWithReadings: number;
	hasConditions: boolean;
	state: 'complete' | 'partial' | 'missing';
};

export type PlaneCoverage = {
	planeId: string;
	plannedPoints: number;
	pointsWithReadings: number;
	runs: number;
	runsComplete: number;
};

export type ReadingsCoverage = {
	revisionNumber: number;
	plannedPoints: number;
	pointsWithReadings: number;
	readingCount: number;
	runs: { planned: number; complete: number; partial: number; missing: number };
	/** Runs without a single reading, in run order. */
	missingRuns: number[];
	perPlane: PlaneCoverage[];
	perRun: RunCoverage[];
};

/**
 * How much of the approved matrix has readings: per run, per plane and overall. A run is
 * complete when every planned point has a reading and the run has its reference conditions.
 */
export function readingsCoverage(db: DbOrTx, approved: ApprovedLayout): ReadingsCoverage {
	const current = and(eq(reading.revisionId, approved.revisionId), isNull(reading.supersededBy));
	// Points with readings per run, from the points alone: runs are contiguous ranges of points.
	const byRun = new Map<number, number>();
	let lastPoint = 0;
	for (const { point } of db
		.select({ point: reading.point })
		.from(reading)
		.where(current)
		.orderBy(asc(reading.point))
		.all()) {
		if (point === lastPoint) continue;
		lastPoint = point;
		const run = locatePoint(approved.layout, point)?.run.run;
		if (run !== undefined) byRun.set(run, (byRun.get(run) ?? 0) + 1);
	}
	const readingCount =
		db
			.select({ n: sql<number>`count(*)` })
			.from(reading)
			.where(current)
			.get()?.n ?? 0;
	const withConditions = new Set(
		db
			.select({ run: runCondition.run })
			.from(runCondition)
			.where(
				and(eq(runCondition.revisionId, approved.revisionId), isNull(runCondition.supersededBy))
			)
			.all()
			.map((r) => r.run)
	);

	const perRun: RunCoverage[] = approved.layout.runs.map((r) => {
		const plannedPoints = r.rows * r.columns;
		const pointsWithReadings = byRun.get(r.run) ?? 0;
		const hasConditions = withConditions.has(r.run);
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
			state:
				pointsWithReadings === 0
					? 'missing'
					: pointsWithReadings === plannedPoints && hasConditions
						? 'complete'
						: 'partial'
		};
	});
	const perPlane = approved.plan.planes.map((p) => {
		const runs = perRun.filter((r) => r.planeId === p.id);
		return {
			planeId: p.id,
			plannedPoints: runs.reduce((n, r) => n + r.plannedPoints, 0),
			pointsWithReadings: runs.reduce((n, r) => n + r.pointsWithReadings, 0),
			runs: runs.length,
			runsComplete: runs.filter((r) => r.state === 'complete').length
		};
	});
	const count = (state: RunCoverage['state']) => perRun.filter((r) => r.state === state).length;
	return {
		revisionNumber: approved.revisionNumber,
		plannedPoints: approved.layout.pointCount,
		pointsWithReadings: perRun.reduce((n, r) => n + r.pointsWithReadings, 0),
		readingCount,
		runs: {
			planned: perRun.length,
			complete: count('complete'),
			partial: count('partial'),
			missing: count('missing')
		},
		missingRuns: perRun.filter((r) => r.state === 'missing').map((r) => r.run),
		perPlane,
		perRun
	};
}

/** The current readings of a revision in point order, a page at a time. */
export function currentReadings(db: DbOrTx, revisionId: string, offset: number, limit: number) {
	return db
		.select({
			point: reading.point,
			run: reading.run,
			kind: reading.kind,
			pressure_Pa: reading.pressure_Pa,
			value: reading.value,
			unit: reading.unit,
			inclination_deg: reading.inclination_deg,
			fluidDensity_kgm3: reading.fluidDensity_kgm3,
			measuredAt: reading.measuredAt,
			note: reading.note,
			uploadId: reading.uploadId
		})
		.from(reading)
		.where(and(eq(reading.revisionId, revisionId), isNull(reading.supersededBy)))
		.orderBy(asc(reading.point), asc(reading.kind))
		.limit(limit)
		.offset(offset)
		.all();
}

/** The current reference conditions of a revision's runs. */
export function currentConditions(db: DbOrTx, revisionId: string) {
	return db
		.select({
			run: runCondition.run,
			referenceDynamicPressure_Pa: runCondition.referenceDynamicPressure_Pa,
			airTemperature_K: runCondition.airTemperature_K,
			barometricPressure_Pa: runCondition.barometricPressure_Pa,
			relativeHumidity: runCondition.relativeHumidity,
			uploadId: runCondition.uploadId
		})
		.from(runCondition)
		.where(and(eq(runCondition.revisionId, revisionId), isNull(runCondition.supersededBy)))
		.orderBy(asc(runCondition.run))
		.all();
}

/** Every readings file a campaign received, newest first, without the storage key. */
export function readingsUploads(db: DbOrTx, campaignId: string) {
	return db
		.select({
			id: readingsUpload.id,
			fileName: readingsUpload.fileName,
			mediaType: readingsUpload.mediaType,
			size_bytes: readingsUpload.size_bytes,
			sha256: readingsUpload.sha256,
			channel: readingsUpload.channel,
			uploaderName: readingsUpload.uploaderName,
			readingCount: readingsUpload.readingCount,
			runCount: readingsUpload.runCount,
			replacedCount: readingsUpload.replacedCount,
			createdAt: readingsUpload.createdAt
		})
		.from(readingsUpload)
		.where(eq(readingsUpload.campaignId, campaignId))
		.orderBy(desc(readingsUpload.createdAt))
		.all();
}
