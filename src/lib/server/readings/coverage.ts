import { asc, sql } from 'drizzle-orm';
import { locatePoint } from '../../calc';
import { readingsCoverageOf } from '../../readings/coverage';
import type { ReadingsCoverage } from '../../readings/types';
import type { DbOrTx } from '../db/open';
import { reading, runCondition } from '../db/schema';
import { currentCondition, currentReading } from './current';
import type { ApprovedLayout } from './layout';

/** How much of the approved matrix has readings, counted from the revision's current rows. */
export function readingsCoverage(db: DbOrTx, approved: ApprovedLayout): ReadingsCoverage {
	const current = currentReading(approved.revisionId);
	// Points with readings per run, from the points alone: runs are contiguous ranges of points.
	const pointsByRun = new Map<number, number>();
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
		if (run !== undefined) pointsByRun.set(run, (pointsByRun.get(run) ?? 0) + 1);
	}
	const readingCount =
		db
			.select({ n: sql<number>`count(*)` })
			.from(reading)
			.where(current)
			.get()?.n ?? 0;
	const runsWithConditions = new Set(
		db
			.select({ run: runCondition.run })
			.from(runCondition)
			.where(currentCondition(approved.revisionId))
			.all()
			.map((r) => r.run)
	);
	return readingsCoverageOf(approved.revisionNumber, approved.plan, approved.layout, {
		pointsByRun,
		runsWithConditions,
		readingCount
	});
}
