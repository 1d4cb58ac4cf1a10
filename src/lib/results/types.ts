import type { Finding, RunIdentity } from '../calc';
import type { MeasuredConditions } from '../readings/types';

/**
 * The reduced results of a campaign's approved revision, as the results pages, the CSV export
 * and `GET /api/v1/campaigns/:id/results` give them. Uncertainties are standard uncertainties
 * (k = 1, JCGM 100:2008); pages show expanded ones with k = 2.
 */

/** A run's air and flow as measured, beside what the plan assumed. */
export type RunConditions = MeasuredConditions & {
	/** Relative humidity is null when the file gave none; the air is then taken as dry and a note says so. */
	density_kgm3: number;
	/** V = √(2q/ρ) from the reference dynamic pressure. */
	measuredSpeed_mps: number;
	achievedRe: number;
	achievedMach: number;
	plannedSpeed_mps: number;
	plannedRe: number;
	plannedMach: number;
	uncertainty: {
		/** The facility's reference-q calibration, a fraction of this run's q. */
		referenceDynamicPressure_Pa: number;
		density_kgm3: number;
		measuredSpeed_mps: number;
		achievedRe: number;
	};
};

/** One probe position of a run: its readings reduced to coefficients. */
export type ReducedPoint = {
	point: number;
	row: number;
	column: number;
	y_m: number;
	z_m: number;
	/** (p − p∞)/q∞ from the static reading; null without one. */
	cp: number | null;
	/** Cp with the blockage correction of the approved revision applied. */
	cpCorrected: number | null;
	/** (p0 − p∞)/q∞ from the total reading; null without one. */
	cp0: number | null;
	/** Standard uncertainty of cp. */
	uCp: number | null;
};

/** Averages of a grid of coefficients and their standard uncertainties. */
export type GridSummary = {
	average: number | null;
	rowAverages: (number | null)[];
	columnAverages: (number | null)[];
	count: number;
	uncertainty: {
		average: number | null;
		rowAverages: (number | null)[];
		columnAverages: (number | null)[];
	};
};

export type WakeDrag = {
	dragCoefficient: number;
	uncertainty: number;
	integratedArea_m2: number;
	referenceArea_m2: number;
	notes: Finding[];
};

/** One traverse (plane × configuration × yaw × speed × repeat) with readings. */
export type PlaneRunResult = RunIdentity & {
	planeLabel: string;
	configurationLabel: string;
	baseline: boolean;
	downstream_m: number;
	y_m: number[];
	z_m: number[];
	conditions: RunConditions | null;
	dynamicPressureFactor: number;
	/** Cp as measured against the run's reference q. */
	averageCp: number | null;
	rowAverageCp: (number | null)[];
	columnAverageCp: (number | null)[];
	/** The plane average with the blockage correction applied. */
	averageCpCorrected: number | null;
	count: number;
	uncertainty: {
		averageCp: number | null;
		rowAverageCp: (number | null)[];
		columnAverageCp: (number | null)[];
	};
	/** Rows of points, [row][column]. */
	points: ReducedPoint[][];
	wake: WakeDrag | null;
	/** Variant − baseline at the same yaw, speed, plane and repeat; null for the baseline itself. */
	difference: (GridSummary & { baselineRun: number; points: (number | null)[][] }) | null;
	notes: Finding[];
};

/** Plane-average Cp against downstream distance for one configuration at one yaw and speed. */
export type DistanceTrend = {
	configurationId: string;
	configurationLabel: string;
	baseline: boolean;
	yaw_deg: number;
	speed_mps: number;
	points: {
		planeId: string;
		downstream_m: number;
		averageCp: number;
		uncertainty: number;
		/** Variant − baseline plane average, when a baseline was chosen. */
		difference: number | null;
		differenceUncertainty: number | null;
		repeats: number;
	}[];
	/** Least-squares line through the plane averages; null with fewer than 3 planes. */
	fit: {
		slope: number;
		intercept: number;
		slopeUncertainty: number;
		interceptUncertainty: number;
		rSquared: number;
	} | null;
};

/** Wake-survey drag against achieved Re for one configuration, yaw and plane. */
export type ReynoldsSweepResult = {
	configurationId: string;
	configurationLabel: string;
	yaw_deg: number;
	planeId: string;
	points: { re: number; value: number; uncertainty: number; speed_mps: number }[];
	relativeChanges: number[];
	/** For each relative change, whether it exceeds the tolerance. */
	overTolerance: boolean[];
	tolerance: number;
	independentFromRe: number | null;
	notes: Finding[];
};

export type CampaignResults = {
	revision: number;
	baselineConfigurationId: string | null;
	modelReferenceLength_m: number;
	referenceArea_m2: number;
	runs: PlaneRunResult[];
	trends: DistanceTrend[];
	sweeps: ReynoldsSweepResult[];
	/** The instrument uncertainties the figures were propagated from. */
	instrumentUncertainties: {
		readingUncertainty_Pa: number;
		referenceQUncertainty: number;
		temperatureUncertainty_K: number;
		barometricUncertainty_Pa: number;
		humidityUncertainty: number;
	};
	notes: Finding[];
};
