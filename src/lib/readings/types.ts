import type { RunIdentity } from '../calc';

/**
 * The shapes of readings intake that the pages, the API and the server share. Nothing here
 * touches the database, so components import these rather than `$lib/server`.
 */

/** One thing wrong with a readings file: its row (1 = the header line), column and reason. */
export type ReadingProblem = { row: number | null; column: string | null; reason: string };

/** A run's reference conditions as the file gave them, in SI units. */
export type MeasuredConditions = {
	referenceDynamicPressure_Pa: number;
	airTemperature_K: number;
	barometricPressure_Pa: number;
	/** Null when the file gave none. */
	relativeHumidity: number | null;
};

/** Where a received file stands while the server takes it. */
export type ReceivePhase = 'parse' | 'check' | 'store';

/** What the server says of a file it stored. */
export type UploadSummary = {
	id: string;
	fileName: string;
	sha256: string;
	readingCount: number;
	runCount: number;
	replacedCount: number;
};

/** A readings file as the campaign's list of received files shows it. */
export type ReceivedFile = UploadSummary & {
	mediaType: string;
	size_bytes: number;
	channel: 'page' | 'api';
	uploaderName: string;
	createdAt: Date;
};

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
